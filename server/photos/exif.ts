// The one EXIF fact Hueledger keeps beyond orientation (which sharp reads): the capture time.
// Read from the TIFF structure EXIF uses (CIPA DC-008-2019 "Exif 2.32" § 4.6; TIFF 6.0 § 2),
// defensively: every offset is bounds-checked, since the bytes come from an upload.

/** Exif IFD pointer in IFD0 (Exif 2.32 § 4.6.3). */
const TAG_EXIF_IFD = 0x8769;
/** DateTimeOriginal, "YYYY:MM:DD HH:MM:SS" (Exif 2.32 § 4.6.5, tag 36867). */
const TAG_DATE_TIME_ORIGINAL = 0x9003;
/** OffsetTimeOriginal, "+HH:MM" (Exif 2.31 and later, tag 36881). */
const TAG_OFFSET_TIME_ORIGINAL = 0x9011;
/** DateTime of IFD0, the file's change time: a fallback when the original time is missing (tag 306). */
const TAG_DATE_TIME = 0x0132;
/** TIFF field type ASCII. */
const TYPE_ASCII = 2;
/** Most IFD entries read (our own guard against a hostile count). */
const MAX_ENTRIES = 512;

const DATE_TIME = /^(\d{4}):(\d{2}):(\d{2}) (\d{2}):(\d{2}):(\d{2})$/;
const OFFSET = /^[+-]\d{2}:\d{2}$/;

/**
 * The capture time in sharp's raw EXIF block (`metadata().exif`, which starts "Exif\0\0"), as ISO
 * 8601 local time, with the camera's offset when it wrote one: "2026-03-14T09:30:05+10:00".
 * `null` when absent, blank ("0000:00:00 …") or malformed.
 */
export function exifCaptureTime(exif: Buffer | undefined): string | null {
  if (!exif) return null;
  const start = exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0;
  const tiff = exif.subarray(start);
  try {
    const reader = new TiffReader(tiff);
    const ifd0 = reader.ifd(reader.u32(4));
    const exifIfdOffset = ifd0.get(TAG_EXIF_IFD)?.value;
    const exifIfd = exifIfdOffset !== undefined ? reader.ifd(exifIfdOffset) : new Map<number, Entry>();
    const when = reader.ascii(exifIfd.get(TAG_DATE_TIME_ORIGINAL)) ?? reader.ascii(ifd0.get(TAG_DATE_TIME));
    const offset = reader.ascii(exifIfd.get(TAG_OFFSET_TIME_ORIGINAL));
    return when ? isoLocal(when, offset) : null;
  } catch {
    return null;
  }
}

function isoLocal(when: string, offset: string | null): string | null {
  const m = DATE_TIME.exec(when.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s] = m.map(Number) as number[];
  if (y! < 1900 || mo! < 1 || mo! > 12 || d! < 1 || d! > 31 || h! > 23 || mi! > 59 || s! > 60) return null;
  const local = `${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}`;
  return offset && OFFSET.test(offset.trim()) ? local + offset.trim() : local;
}

interface Entry {
  type: number;
  count: number;
  /** The value field read as a 32-bit number (an offset for values over 4 bytes). */
  value: number;
  /** Where the 4-byte value field starts. */
  at: number;
}

class TiffReader {
  private readonly little: boolean;

  constructor(private readonly buf: Buffer) {
    const order = buf.subarray(0, 2).toString('latin1');
    if (order !== 'II' && order !== 'MM') throw new Error('not a TIFF header');
    this.little = order === 'II';
    if (this.u16(2) !== 42) throw new Error('not a TIFF header');
  }

  u16(at: number): number {
    this.check(at, 2);
    return this.little ? this.buf.readUInt16LE(at) : this.buf.readUInt16BE(at);
  }

  u32(at: number): number {
    this.check(at, 4);
    return this.little ? this.buf.readUInt32LE(at) : this.buf.readUInt32BE(at);
  }

  ifd(at: number): Map<number, Entry> {
    const n = Math.min(this.u16(at), MAX_ENTRIES);
    const entries = new Map<number, Entry>();
    for (let i = 0; i < n; i++) {
      const e = at + 2 + i * 12;
      entries.set(this.u16(e), { type: this.u16(e + 2), count: this.u32(e + 4), value: this.u32(e + 8), at: e + 8 });
    }
    return entries;
  }

  ascii(entry: Entry | undefined): string | null {
    if (!entry || entry.type !== TYPE_ASCII || entry.count === 0 || entry.count > 64) return null;
    const at = entry.count <= 4 ? entry.at : entry.value;
    this.check(at, entry.count);
    const text = this.buf.toString('latin1', at, at + entry.count).replace(/\0.*$/s, '');
    return text || null;
  }

  private check(at: number, length: number): void {
    if (at < 0 || at + length > this.buf.length) throw new Error('EXIF offset out of range');
  }
}
