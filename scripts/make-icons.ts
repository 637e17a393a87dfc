// Draws the installable app's icons from our own mark (static/icons/app-icon.svg): the squish band
// between a head and a piston crown. Run by hand when the mark changes; the PNGs are committed.
//   npx tsx scripts/make-icons.ts
import sharp from 'sharp';

const svg = 'static/icons/app-icon.svg';
for (const size of [192, 512]) {
	await sharp(svg, { density: 600 })
		.resize(size, size)
		.png()
		.toFile(`static/icons/app-${size}.png`);
}
// Maskable: the mark inside the middle 80 % (the safe zone), on the paper colour.
const inner = await sharp(svg, { density: 600 }).resize(410, 410).png().toBuffer();
await sharp({ create: { width: 512, height: 512, channels: 4, background: '#f6f1e7' } })
	.composite([{ input: inner, gravity: 'centre' }])
	.png()
	.toFile('static/icons/app-maskable-512.png');
