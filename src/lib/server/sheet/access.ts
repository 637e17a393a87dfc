import { error, type RequestEvent } from '@sveltejs/kit';
import { roleAllows } from '../../roles';
import * as builds from './builds';
import * as parts from './parts';
import * as runs from './runs';
import * as setups from './setups';
import { requireUser } from '../guard';
import { takenDownMessage } from '../../review/taken-down';

/**
 * Who sees a build: anyone when published and visible; its owner always; an admin always; a
 * moderator also when hidden. Others get 410 with the desk's public reason for a build taken
 * down, and 404 for anything else, so a draft's existence is not revealed.
 */
export async function readBuild(event: RequestEvent, id: number) {
	const b = await builds.read(id);
	if (!b) error(404, 'No such build.');
	const me = event.locals.user;
	const mine = me?.id === b.ownerId;
	const open = b.publication === 'published' && b.moderation === 'visible';
	const staff =
		me &&
		(roleAllows(me.role, 'admin') ||
			(b.moderation === 'hidden' &&
				b.publication === 'published' &&
				roleAllows(me.role, 'moderator')));
	if (!open && !mine && !staff) {
		// A published build the desk took down: readers are told so, with the public reason, as
		// for a comment. A draft stays a plain 404, so its existence is not revealed.
		if (b.publication === 'published' && b.moderation === 'hidden')
			error(410, takenDownMessage(b.hiddenReason));
		error(404, 'No such build.');
	}
	return { build: b, canEdit: Boolean(mine || (me && roleAllows(me.role, 'admin'))) };
}

/** Only the owner or an admin edits; others see 403 if they can read the build, else 404. */
export async function editBuild(event: RequestEvent, id: number) {
	const me = requireUser(event);
	const { build, canEdit } = await readBuild(event, id);
	if (!canEdit) error(403, 'Only the builder can change this sheet.');
	return { build, me };
}

/** A setup of a build the signed-in member may change, from `params.id` and `params.setupId`. */
export async function editSetup(event: RequestEvent & { params: { id: string; setupId: string } }) {
	const { build } = await editBuild(event, Number(event.params.id));
	const setup = await setups.read(build.id, Number(event.params.setupId));
	if (!setup) error(404, 'No such setup.');
	return { build, setup };
}

/** A run of a build the signed-in member may change, from `params.id` and `params.runId`. */
export async function editRun(event: RequestEvent & { params: { id: string; runId: string } }) {
	const { build } = await editBuild(event, Number(event.params.id));
	const run = await runs.read(build.id, Number(event.params.runId));
	if (!run) error(404, 'No such run.');
	return { build, run };
}

/** A part of a build the signed-in member may change, from `params.id` and `params.partId`. */
export async function editPart(event: RequestEvent & { params: { id: string; partId: string } }) {
	const { build } = await editBuild(event, Number(event.params.id));
	const part = await parts.read(build.id, Number(event.params.partId));
	if (!part) error(404, 'No such part.');
	return { build, part };
}

/**
 * Whether the reader may see the parts of a build the review desk took down (a hidden setup):
 * its owner, moderators and admins. Everyone else gets the build without them, in every format.
 */
export function seesTakenDown(event: RequestEvent, b: { ownerId: string | null }): boolean {
	const me = event.locals.user;
	return Boolean(me && (me.id === b.ownerId || roleAllows(me.role, 'moderator')));
}
