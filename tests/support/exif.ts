// A minimal EXIF (TIFF) reader for tests: which tags an EXIF block holds, including the GPS IFD.
// Enough to prove a fixture carries GPS data and that the stored files carry none. Layout per the
// EXIF 2.32 / TIFF 6.0 specifications [S: CIPA DC-008 (EXIF 2.32), TIFF 6.0 §2].

export interface ExifTags {
  /** Tag ids found in IFD0 (e.g. 0x010f Make, 0x0112 Orientation, 0x8825 GPSInfo pointer). */
  ifd0: number[];
  /** Tag ids found in the GPS IFD (0x0001 GPSLatitudeRef, 0x0002 GPSLatitude…). */
  gps: number[];
}

export const TAG_GPS_POINTER = 0x8825;
export const TAG_ORIENTATION = 0x0112;

/** Parse the EXIF block sharp returns in `metadata().exif` (starts with "Exif\0\0", then a TIFF header). */
export function readExifTags(exif: Buffer): ExifTags {
  const start = exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0;
  const tiff = exif.subarray(start);
  const order = tiff.subarray(0, 2).toString('latin1');
  if (order !== 'II' && order !== 'MM') throw new Error('Not a TIFF header');
  const le = order === 'II';
  const u16 = (o: number) => (le ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (le ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const entries = (offset: number) => {
    const n = u16(offset);
    return Array.from({ length: n }, (_, i) => {
      const at = offset + 2 + i * 12;
      return { tag: u16(at), value: u32(at + 8) };
    });
  };
  const ifd0 = entries(u32(4));
  const gpsPointer = ifd0.find((e) => e.tag === TAG_GPS_POINTER);
  return { ifd0: ifd0.map((e) => e.tag), gps: gpsPointer ? entries(gpsPointer.value).map((e) => e.tag) : [] };
}
