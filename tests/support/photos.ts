import sharp from 'sharp';

const XMP = `<?xpacket begin="" id="W5M0MpCehiHzreSzNTczkc9d"?><x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description xmlns:dc="http://purl.org/dc/elements/1.1/"><dc:creator><rdf:Seq><rdf:li>Garage owner</rdf:li></rdf:Seq></dc:creator></rdf:Description></rdf:RDF></x:xmpmeta><?xpacket end="w"?>`;

/** A 300 × 200 JPEG stored sideways (EXIF orientation 6) carrying GPS and XMP, like a phone photo. */
export async function phonePhoto(): Promise<Buffer> {
	return sharp({ create: { width: 300, height: 200, channels: 3, background: '#556677' } })
		.composite([
			{
				input: { create: { width: 60, height: 200, channels: 3, background: '#a8471f' } },
				left: 0,
				top: 0
			}
		])
		.jpeg()
		.withExif({
			IFD0: { Make: 'Bench Cam', Model: 'Workshop 1' },
			IFD3: {
				GPSLatitudeRef: 'N',
				GPSLatitude: '51/1 28/1 0/1',
				GPSLongitudeRef: 'W',
				GPSLongitude: '0/1 0/1 0/1'
			}
		})
		.withMetadata({ orientation: 6 })
		.withXmp(XMP)
		.toBuffer();
}

export const smallPng = () =>
	sharp({ create: { width: 64, height: 48, channels: 3, background: '#2a2926' } })
		.png()
		.toBuffer();
