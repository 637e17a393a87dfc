// How each pipe type is drawn on the speed map: a colour from the notebook's palette and a shape of
// its own, so neither colour nor shape alone carries the meaning.
export const PIPE_STYLE: Record<string, { label: string; colour: string; symbol: string }> = {
	stock: { label: 'stock exhaust', colour: '#55524b', symbol: 'circle' },
	sport: { label: 'sport silencer', colour: '#8a5a00', symbol: 'square' },
	'expansion-chamber': { label: 'expansion chamber', colour: '#a8471f', symbol: 'triangle' }
};

export const pipeLabel = (p: unknown) => PIPE_STYLE[String(p)]?.label ?? 'not given';
