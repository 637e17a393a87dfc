import type { Handle } from '@sveltejs/kit';

// A member who chose light or dark pages gets them from the first byte (no flash of the other):
// the choice is written on <html>. Without one, the page follows the device (app.css).
export const themeAttribute: Handle = ({ event, resolve }) => {
	const theme = event.locals.user?.theme;
	if (!theme || theme === 'device') return resolve(event);
	return resolve(event, {
		transformPageChunk: ({ html }) =>
			html.replace('<html lang="en">', `<html lang="en" data-theme="${theme}">`)
	});
};
