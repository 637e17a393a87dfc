import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { models } from '../../src/lib/server/db/models';
import { objectExists } from '../../src/lib/server/storage/objects';
import { phonePhoto, smallPng } from '../support/photos';
import { makeUser, signInWithPassword } from './support';

const origin = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100';
type ApiPhoto = { id: number; caption: string; sourceFormat: string; display: string };

async function photosOf(page: Page, buildId: number): Promise<ApiPhoto[]> {
	return (await (await page.request.get(`/api/builds/${buildId}/photos`)).json()).photos;
}

async function chooseAndUpload(page: Page, name: string, buffer: Buffer, caption: string) {
	await page.getByLabel('Caption', { exact: true }).first().fill(caption);
	await page.getByLabel(/^Photo \(JPEG/).setInputFiles({ name, mimeType: 'image/jpeg', buffer });
	await page.getByRole('button', { name: 'Upload the photo' }).click();
}

test('photos: metadata stripped and upright, type read from the bytes, limits with messages, reorder and delete', async ({
	page
}) => {
	test.setTimeout(90_000);
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	const res = await page.request.post('/api/builds', {
		data: { title: 'Photo bench' },
		headers: { origin }
	});
	const { id } = await res.json();
	await page.goto(`/builds/${id}/edit#photos`);
	await page.waitForLoadState('networkidle');

	// A sideways phone photo with GPS, camera EXIF and XMP.
	const phone = await phonePhoto();
	const before = await sharp(phone).metadata();
	expect(before.orientation).toBe(6);
	expect(before.exif && before.xmp).toBeTruthy();
	await chooseAndUpload(page, 'garage.jpg', phone, 'Ported cases');
	await expect(page.getByRole('img', { name: 'Ported cases' })).toBeVisible();
	const [first] = await photosOf(page, id);
	const stored = await sharp(
		Buffer.from(await (await page.request.get(first.display)).body())
	).metadata();
	expect(stored.format).toBe('jpeg');
	expect(stored.exif).toBeUndefined();
	expect(stored.xmp).toBeUndefined();
	expect(stored.iptc).toBeUndefined();
	expect(stored.orientation).toBeUndefined();
	expect([stored.width, stored.height]).toEqual([200, 300]); // turned upright

	// A PNG named .jpg is taken as the PNG it is.
	await chooseAndUpload(page, 'plug-reading.jpg', await smallPng(), 'Plug after run 3');
	await expect(page.getByRole('img', { name: 'Plug after run 3' })).toBeVisible();
	expect((await photosOf(page, id)).map((p) => p.sourceFormat)).toEqual(['jpeg', 'png']);

	// A text file named .jpg is refused, and the typed caption stays.
	await chooseAndUpload(
		page,
		'notes.jpg',
		Buffer.from('torque figures, not a picture'),
		'Should stay typed'
	);
	await expect(page.getByRole('alert')).toContainText('not a JPEG, PNG, WebP or HEIC');
	await expect(page.getByLabel('Caption', { exact: true }).first()).toHaveValue(
		'Should stay typed'
	);

	// 16 MB is over the limit.
	await chooseAndUpload(page, 'huge.jpg', Buffer.alloc(16 * 1024 * 1024, 1), 'Too big');
	await expect(page.getByRole('alert')).toContainText('over 15 MB');
	await expect(page.getByLabel('Caption', { exact: true }).first()).toHaveValue('Too big');

	// Fill to twelve through the API, then the thirteenth is refused.
	const png = await smallPng();
	for (let i = 3; i <= 12; i++) {
		const r = await page.request.post(`/api/builds/${id}/photos`, {
			multipart: {
				file: { name: `p${i}.png`, mimeType: 'image/png', buffer: png },
				caption: `Photo ${i}`
			},
			headers: { origin }
		});
		expect(r.status()).toBe(201);
	}
	await page.reload();
	await chooseAndUpload(page, 'thirteen.png', png, 'One too many');
	await expect(page.getByRole('alert')).toContainText('at most 12 photos');

	// Reorder with the keyboard-reachable buttons: photo 2 moves first.
	await page.getByRole('button', { name: 'Move photo 2 earlier' }).click();
	await expect
		.poll(async () => (await photosOf(page, id)).slice(0, 2).map((p) => p.caption))
		.toEqual(['Plug after run 3', 'Ported cases']);

	// Deleting removes both stored objects.
	const row = (await models().Photo.findByPk(first.id))!;
	expect(await objectExists(row.displayKey)).toBe(true);
	await page.getByRole('button', { name: 'Delete photo 2' }).click();
	await expect(page.getByRole('img', { name: 'Ported cases' })).toHaveCount(0);
	expect(await objectExists(row.displayKey)).toBe(false);
	expect(await objectExists(row.thumbKey)).toBe(false);
	expect(await photosOf(page, id)).toHaveLength(11);
});

test('a demo build with five setups prints on at most two pages', async ({ page }) => {
	const b = await models().Build.findOne({
		where: { setupCount: 5, publication: 'published' },
		order: [['id', 'ASC']]
	});
	expect(b).not.toBeNull();
	await page.goto(`/builds/${b!.id}`);
	await page.emulateMedia({ media: 'print' });
	await expect(page.getByText('squishline build sheet')).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Setup history', exact: true })).toBeHidden();
	const pdf = (
		await page.pdf({
			format: 'A4',
			margin: { top: '12mm', bottom: '12mm', left: '12mm', right: '12mm' }
		})
	).toString('latin1');
	const pages = pdf.match(/\/Type\s*\/Page[^s]/g)?.length ?? 0;
	expect(pages).toBeGreaterThanOrEqual(1);
	expect(pages).toBeLessThanOrEqual(2);
});
