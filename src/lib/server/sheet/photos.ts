import { randomUUID } from 'node:crypto';
import pLimit from 'p-limit';
import sharp, { type Sharp } from 'sharp';
import { Failure } from '../../failure';
import { models } from '../db/models';
import { inTransaction } from '../db/transaction';
import { checkSetupOf } from './service';
import { deleteObjects, deleteLater, IMMUTABLE, putObject, StorageDown } from '../storage/objects';

export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
export const PHOTO_MAX_COUNT = 12;
/** 50 megapixels: a full-resolution phone photo fits (8000 × 6000); decoding one takes ~200 MB. */
export const PHOTO_MAX_PIXELS = 50_000_000;
const FORMATS = new Set(['jpeg', 'png', 'webp', 'heif']);

export const STORAGE_DOWN =
	'Photo storage is unavailable just now, so nothing was saved. Try again in a minute.';

// Decoding and re-encoding is the memory-hungry part: two images at a time per process, the
// rest wait their turn, so a burst of large uploads cannot take the server's memory.
const imageWork = pLimit(2);

const mp = (n: number) => `${Math.round(n / 100_000) / 10} megapixels`;

/** The upload rules shared by build photos and shop logos: size, type read from the bytes, pixels. */
export async function checkImage(bytes: Uint8Array): Promise<string> {
	if (bytes.byteLength > PHOTO_MAX_BYTES)
		throw new Failure(413, 'That image is over 15 MB. Export it smaller and try again.');
	if (bytes.byteLength === 0) throw new Failure(422, 'The file is empty.');
	// The header only (no decoding), with no pixel limit, so a huge image is named as huge.
	const meta = await sharp(bytes, { limitInputPixels: false })
		.metadata()
		.catch(() => null);
	if (!meta?.format || !FORMATS.has(meta.format))
		throw new Failure(415, 'That file is not a JPEG, PNG, WebP or HEIC image.');
	const pixels = (meta.width ?? 0) * (meta.height ?? 0);
	if (pixels > PHOTO_MAX_PIXELS)
		throw new Failure(
			413,
			`That image is ${meta.width} × ${meta.height} pixels (${mp(pixels)}); the most we take is ${mp(PHOTO_MAX_PIXELS)}, such as 8000 × 6000. Export it smaller and try again.`
		);
	return meta.format;
}

/** Decodes with the pixel cap, one of the limited image slots at a time. */
export function withImage<T>(bytes: Uint8Array, work: (img: Sharp) => Promise<T>): Promise<T> {
	return imageWork(() =>
		work(sharp(bytes, { failOn: 'error', limitInputPixels: PHOTO_MAX_PIXELS }))
	);
}

/**
 * Stores a photo: the type is read from the bytes, the image is turned upright from its
 * orientation tag and re-encoded without any metadata (phone photos carry the garage's GPS
 * position), in a display size and a thumbnail, under keys we make. All or nothing.
 */
export async function addPhoto(
	buildId: number,
	bytes: Uint8Array,
	opts: { caption?: string; setupId?: number | null } = {}
) {
	const { Photo, Build } = models();
	await checkSetupOf(buildId, opts.setupId ?? null);
	if ((await Photo.count({ where: { buildId } })) >= PHOTO_MAX_COUNT) throw full();
	const format = await checkImage(bytes);
	let display: { data: Buffer; info: { width: number; height: number } };
	let thumb: Buffer;
	try {
		[display, thumb] = await withImage(bytes, async (img) => {
			// sharp writes no metadata unless asked to (withMetadata), so EXIF, XMP and IPTC are gone.
			const upright = img.rotate();
			return Promise.all([
				upright
					.clone()
					.resize(1600, 1600, { fit: 'inside', withoutEnlargement: true })
					.jpeg({ quality: 82, mozjpeg: true })
					.toBuffer({ resolveWithObject: true }),
				upright
					.clone()
					.resize(400, 400, { fit: 'inside', withoutEnlargement: true })
					.jpeg({ quality: 78, mozjpeg: true })
					.toBuffer()
			]);
		});
	} catch {
		throw new Failure(
			415,
			'We could not read that image (damaged, or a kind of HEIC this server cannot open).'
		);
	}
	const stem = `builds/${buildId}/photos/${randomUUID()}`;
	const keys = { displayKey: `${stem}-display.jpg`, thumbKey: `${stem}-thumb.jpg` };
	try {
		// Keys are never reused, so the store may tell every cache to keep them for good.
		await putObject(keys.displayKey, display.data, 'image/jpeg', IMMUTABLE);
		await putObject(keys.thumbKey, thumb, 'image/jpeg', IMMUTABLE);
		// The count is checked again under a lock on the build row: of several uploads racing for
		// the last places, only as many as fit are kept.
		return await inTransaction(async (transaction) => {
			await Build.findByPk(buildId, { transaction, lock: transaction.LOCK.UPDATE });
			if ((await Photo.count({ where: { buildId }, transaction })) >= PHOTO_MAX_COUNT) throw full();
			const max = (await Photo.max('position', { where: { buildId }, transaction })) as
				number | null;
			return Photo.create(
				{
					buildId,
					setupId: opts.setupId ?? null,
					position: (max ?? 0) + 1,
					caption: (opts.caption ?? '').trim().slice(0, 300),
					...keys,
					width: display.info.width,
					height: display.info.height,
					sourceFormat: format
				},
				{ transaction }
			);
		});
	} catch (e) {
		// Nothing stays behind: both keys go now, and again later for a write the store finishes
		// after we gave up on it.
		const both = [keys.displayKey, keys.thumbKey];
		await deleteObjects(both).catch(() => undefined);
		deleteLater(both);
		if (e instanceof StorageDown) throw new Failure(503, STORAGE_DOWN);
		throw e;
	}
}

const full = () =>
	new Failure(409, `A build holds at most ${PHOTO_MAX_COUNT} photos. Delete one first.`);

export async function listPhotos(buildId: number) {
	return models().Photo.findAll({ where: { buildId }, order: [['position', 'ASC']] });
}

export async function readPhoto(id: number) {
	return Number.isInteger(id) && id > 0 ? models().Photo.findByPk(id) : null;
}

export async function removePhoto(buildId: number, id: number): Promise<boolean> {
	const p = await models().Photo.findOne({ where: { id, buildId } });
	if (!p) return false;
	await deleteObjects([p.displayKey, p.thumbKey]);
	await p.destroy();
	return true;
}

export async function updatePhoto(
	buildId: number,
	id: number,
	patch: { caption?: string; setupId?: number | null }
) {
	if (patch.setupId !== undefined) await checkSetupOf(buildId, patch.setupId);
	const [n] = await models().Photo.update(patch, { where: { id, buildId } });
	return n === 1;
}

/** New order from a list of ids; ids not of this build are ignored, missing ones keep their place after. */
export async function reorderPhotos(buildId: number, ids: number[]) {
	const { Photo } = models();
	const photos = await listPhotos(buildId);
	const known = new Set(photos.map((p) => p.id));
	const order = [
		...ids.filter((id) => known.has(id)),
		...photos.map((p) => p.id).filter((id) => !ids.includes(id))
	];
	await inTransaction(async () => {
		for (const [i, id] of order.entries())
			await Photo.update({ position: i + 1 }, { where: { id, buildId } });
	});
}
