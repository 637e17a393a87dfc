// The text rules for dangerous advice. Moderators read this file (it is shown at
// /review/rules); a match raises a flag for the review desk and never hides anything by itself.
// Patterns are matched case-insensitively against the plain text of a story, a setup's note or
// a comment. Each rule's reason is what the desk sees beside the flag.

export type TextRule = {
	code: string;
	label: string;
	reason: string;
	patterns: RegExp[];
};

export const TEXT_RULES: readonly TextRule[] = [
	{
		code: 'brakes-removed',
		label: 'Removing or disabling brakes',
		reason:
			'Advice to remove, disconnect or disable a brake. A faster scooter needs more braking, not less.',
		patterns: [
			/\b(remove|removed|removing|delete|deleted|ditch|ditched|disconnect(ed)?|disable(d)?|unhook(ed)?|pull(ed)?) (the |your |my |a )?(front |rear |back )?brakes?\b/i,
			/\b(without|no) (a |the |any )?(front |rear |back )?brakes?\b/i,
			/\bbrakes? (are|is) (just )?(dead weight|optional|for (cowards|wimps))\b/i
		]
	},
	{
		code: 'no-protective-gear',
		label: 'Riding without protective gear',
		reason: 'Advice to ride without a helmet, gloves or other protective gear.',
		patterns: [
			/\b(ride|riding|rode|test(ing)?|run(ning)?) (it )?(without|with no|w\/o) (a |any )?(helmet|lid|gloves|gear|protective)/i,
			/\b(helmets?|gear) (is|are) (optional|overrated|for (cowards|wimps))\b/i,
			/\bskip (the )?(helmet|gear)\b/i
		]
	},
	{
		code: 'lean-for-speed',
		label: 'Jetting lean "for speed"',
		reason:
			'Advice to jet leaner than the engine needs to gain speed. A lean two-stroke runs hot and can seize or hole a piston.',
		patterns: [
			/\b(jet|jetted|jetting|run(ning)?|go(ing)?|set(ting)?) (it |the carb )?(a bit |a little |slightly |way |really |super )?lean(er)? (for|to get|to gain|to find|=) (more )?(speed|top ?end|power|km\/h|mph)\b/i,
			/\blean(er)? (is|=) (faster|more speed|more power)\b/i,
			/\bdrop (the )?(main )?jet (sizes? )?(until|till) it (seizes|nips|pings)\b/i
		]
	},
	{
		code: 'kill-switch-bypass',
		label: 'Bypassing a kill switch or safety cut-out',
		reason:
			'Advice to bypass or bridge a kill switch, side-stand cut-out or brake-lever start interlock.',
		patterns: [
			/\b(bypass(ed|ing)?|bridge(d)?|jump(ed|er)?|disable(d)?|defeat(ed)?|cut(ting)?) (out )?(the |your )?(kill[ -]?switch|side[ -]?stand (switch|cut[ -]?out)|(brake|start) (lever )?(interlock|switch)|cut[ -]?out)\b/i
		]
	}
];

export type RuleMatch = { code: string; label: string; reason: string; excerpt: string };

/** The rules a text breaks, each once, with the words that matched for the desk to see. */
export function matchRules(text: string, rules: readonly TextRule[] = TEXT_RULES): RuleMatch[] {
	const out: RuleMatch[] = [];
	for (const rule of rules) {
		for (const p of rule.patterns) {
			const m = p.exec(text);
			if (m) {
				const start = Math.max(0, m.index - 40);
				const excerpt = text.slice(start, m.index + m[0].length + 40).replace(/\s+/g, ' ');
				out.push({ code: rule.code, label: rule.label, reason: rule.reason, excerpt });
				break;
			}
		}
	}
	return out;
}

/**
 * Tuning warnings (src/lib/tuning/safety.ts) that flag a published setup. Only the ones that put
 * the rider at risk right now: a tyre run past its speed rating. The other warnings are shown to
 * the reader beside the setup but would bury the desk if each raised a flag.
 */
export const FLAGGED_WARNINGS: readonly string[] = ['tyre-speed-rating'];
