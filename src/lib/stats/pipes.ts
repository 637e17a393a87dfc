// How each pipe type is drawn on the speed map: a colour from the notebook's palette and a shape of
// its own, so neither colour nor shape alone carries the meaning. The colours are mid tones that
// keep at least 3.5:1 against both the light and the dark paper (WCAG 2.2, 1.4.11 asks 3:1 of
// marks), since the drawing is the same for both themes.
export const PIPE_STYLE: Record<string, { label: string; colour: string; symbol: string }> = {
	stock: { label: 'stock exhaust', colour: '#7d786e', symbol: 'circle' },
	sport: { label: 'sport silencer', colour: '#a06a00', symbol: 'square' },
	'expansion-chamber': { label: 'expansion chamber', colour: '#b4561f', symbol: 'triangle' }
};

export const pipeLabel = (p: unknown) => PIPE_STYLE[String(p)]?.label ?? 'not given';
