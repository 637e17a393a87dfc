import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { models } from '../db/models';
import { deleteObjects, putObject } from '../storage';

export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
export const PHOTO_MAX_COUNT = 12;
const FORMATS = new Set(['jpeg', 'png', 'webp', 'heif']);

export class PhotoError extends Error {
	constructor(
		readonly status: 409 | 413 | 415 | 422,
		message: string
	) {
		super(message);
	}
}

/** The upload rules shared by build photos and shop logos: size, then the type read from the bytes. */
export async function checkImage(bytes: Uint8Array): Promise<string> {
	if (bytes.byteLength > PHOTO_MAX_BYTES)
		throw new PhotoError(413, 'That image is over 15 MB. Export it smaller and try again.');
	if (bytes.byteLength === 0) throw new PhotoError(422, 'The file is empty.');
	const meta = await sharp(bytes)
		.metadata()
		.catch(() => null);
	if (!meta?.format || !FORMATS.has(meta.format))
		throw new PhotoError(415, 'That file is not a JPEG, PNG, WebP or HEIC image.');
	return meta.format;
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
	const { Photo } = models();
	if ((await Photo.count({ where: { buildId } })) >= PHOTO_MAX_COUNT)
		throw new PhotoError(409, `A build holds at most ${PHOTO_MAX_COUNT} photos. Delete one first.`);
	const format = await checkImage(bytes);
	let display: { data: Buffer; info: { width: number; height: number } };
	let thumb: Buffer;
	try {
		// sharp writes no metadata unless asked to (withMetadata), so EXIF, XMP and IPTC are gone.
		const upright = sharp(bytes, { failOn: 'error' }).rotate();
		display = await upright
			.clone()
			.resize(1600, 1600, { fit: 'inside', withoutEnlargement: true })
			.jpeg({ quality: 82, mozjpeg: true })
			.toBuffer({ resolveWithObject: true });
		thumb = await upright
			.clone()
			.resize(400, 400, { fit: 'inside', withoutEnlargement: true })
			.jpeg({ quality: 78, mozjpeg: true })
			.toBuffer();
	} catch {
		throw new PhotoError(
			415,
			'We could not read that image (damaged, or a kind of HEIC this server cannot open).'
		);
	}
	const stem = `builds/${buildId}/photos/${randomUUID()}`;
	const keys = { displayKey: `${stem}-display.jpg`, thumbKey: `${stem}-thumb.jpg` };
	const written: string[] = [];
	try {
		await putObject(keys.displayKey, display.data, 'image/jpeg');
		written.push(keys.displayKey);
		await putObject(keys.thumbKey, thumb, 'image/jpeg');
		written.push(keys.thumbKey);
		const max = (await Photo.max('position', { where: { buildId } })) as number | null;
		return await Photo.create({
			buildId,
			setupId: opts.setupId ?? null,
			position: (max ?? 0) + 1,
			caption: (opts.caption ?? '').trim().slice(0, 300),
			...keys,
			width: display.info.width,
			height: display.info.height,
			sourceFormat: format
		});
	} catch (e) {
		await deleteObjects(written).catch(() => undefined);
		throw e;
	}
}

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
	await Photo.sequelize!.transaction(async (transaction) => {
		for (const [i, id] of order.entries())
			await Photo.update({ position: i + 1 }, { where: { id, buildId }, transaction });
	});
}

/** Removes every photo object of a build (before the build row itself goes). */
export async function removeBuildPhotos(buildId: number) {
	const photos = await listPhotos(buildId);
	await deleteObjects(photos.flatMap((p) => [p.displayKey, p.thumbKey]));
}
