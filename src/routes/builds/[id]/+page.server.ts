import QRCode from 'qrcode';
import { env } from '$lib/server/env';
import { idParam, readBuild } from '$lib/server/sheets/access';
import { unitsFor } from '$lib/server/sheets/units';
import { buildView } from '$lib/server/sheets/view';
import { stepsOf } from '$lib/server/stats/change-effects';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, canEdit } = await readBuild(event, idParam(event.params.id));
	const units = unitsFor(event);
	const link = new URL(`/builds/${build.id}`, env().ORIGIN).toString();
	// A small QR code for the printed sheet, so a paper copy leads back to the live one.
	const qr = await QRCode.toString(link, { type: 'svg', margin: 0, errorCorrectionLevel: 'M' });
	const [view, steps] = await Promise.all([buildView(build, units), stepsOf(build.id)]);
	return { units, canEdit, link, qr, steps, ...view };
};
