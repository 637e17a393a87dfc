import { describe, expect, it } from 'vitest';
import { reasonSentence, takenDownMessage } from '../../src/lib/review/taken-down';

describe('the desk’s public reason as a sentence', () => {
	it('ends in one full stop whether or not the moderator typed one', () => {
		expect(reasonSentence('advice to ride without a rear brake')).toBe(
			'advice to ride without a rear brake.'
		);
		expect(reasonSentence('advice to ride without a rear brake.')).toBe(
			'advice to ride without a rear brake.'
		);
		expect(reasonSentence('no brakes!! ')).toBe('no brakes.');
		expect(reasonSentence(null)).toBe('no reason given.');
		expect(takenDownMessage('spam.')).toBe('Taken down by the review desk: spam.');
	});
});
