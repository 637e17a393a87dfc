// Light pages, dark pages, or whatever the device prefers (the default). The colours of both are
// the same tokens (app.css), so every page has both.
export const THEMES = ['device', 'light', 'dark'] as const;
export type Theme = (typeof THEMES)[number];
