import Fuse from 'fuse.js';
import { scooterName, type BaseScooterView } from './catalogue';

// Finding a scooter by a name typed as a tuner remembers it: maker, model, engine family or year,
// a letter or two wrong. The catalogue is small (hundreds), so it is searched whole, here or in
// the browser's picker alike.

type Entry = { s: BaseScooterView; name: string; family: string; years: string };

export function scooterSearch(list: BaseScooterView[]) {
	const entries: Entry[] = list.map((s) => ({
		s,
		name: `${s.maker} ${s.model}`,
		family: s.family.name,
		years: scooterName(s)
	}));
	// Threshold 0.4, as the builds list's typo correction: one or two letters wrong in a name.
	const fuse = new Fuse(entries, {
		keys: [
			{ name: 'name', weight: 3 },
			{ name: 'family', weight: 1 },
			{ name: 'years', weight: 1 }
		],
		threshold: 0.4,
		ignoreLocation: true,
		minMatchCharLength: 2
	});
	return (typed: string): BaseScooterView[] => {
		const q = typed.trim();
		if (!q) return list;
		return fuse.search(q).map((r) => r.item.s);
	};
}
