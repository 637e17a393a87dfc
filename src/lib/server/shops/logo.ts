import { Failure } from '../../failure';
import { randomUUID } from 'node:crypto';
import type { Shop } from '../db/models';
import { checkImage, STORAGE_DOWN, withImage } from '../sheet/photos';
import { deleteLater, deleteObjects, putObject, StorageDown } from '../storage/objects';

/**
 * A shop's logo under the same rules as build photos (15 MB, JPEG, PNG, WebP or HEIC read from
 * the bytes, turned upright, re-encoded without metadata), square-fitted to 320 px. The old
 * object goes once the new one is stored.
 */
export async function setLogo(shop: Shop, bytes: Uint8Array): Promise<void> {
	await checkImage(bytes);
	let data: Buffer;
	try {
		data = await withImage(bytes, (img) =>
			img
				.rotate()
				.resize(320, 320, { fit: 'inside', withoutEnlargement: true })
				.flatten({ background: '#fbf8f1' })
				.jpeg({ quality: 85, mozjpeg: true })
				.toBuffer()
		);
	} catch {
		throw new Failure(415, 'We could not read that image.');
	}
	const key = `shops/${shop.id}/logo-${randomUUID()}.jpg`;
	const previous = shop.logoKey;
	try {
		await putObject(key, data, 'image/jpeg');
		await shop.update({ logoKey: key });
	} catch (e) {
		await deleteObjects([key]).catch(() => undefined);
		deleteLater([key]);
		if (e instanceof StorageDown) throw new Failure(503, STORAGE_DOWN);
		throw e;
	}
	const old = previous;
	if (old) await deleteObjects([old]).catch(() => undefined);
}

export async function removeLogo(shop: Shop): Promise<void> {
	const old = shop.logoKey;
	await shop.update({ logoKey: null });
	if (old) await deleteObjects([old]);
}
