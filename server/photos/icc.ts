// The name of an embedded ICC profile, for provenance ("Display P3", "sRGB IEC61966-2.1").
// Read from the profile's 'desc' tag (ICC.1:2010 § 9.2.41): a v2 textDescriptionType
// (ICC.1:2001-04 § 6.5.17, ASCII) or a v4 multiLocalizedUnicodeType (ICC.1:2010 § 10.15, UTF-16BE).

/** What a photo without a profile is called: it is read as sRGB. */
export const NO_PROFILE = 'none';
/** Stored name length (the column holds 120). */
const NAME_MAX = 120;

/** The description of an ICC profile, or "unnamed profile" when it carries none that can be read. */
export function iccProfileName(icc: Buffer | undefined): string {
  if (!icc || icc.length < 132) return NO_PROFILE;
  try {
    const tags = icc.readUInt32BE(128);
    for (let i = 0; i < Math.min(tags, 256); i++) {
      const entry = 132 + i * 12;
      if (icc.toString('latin1', entry, entry + 4) !== 'desc') continue;
      const offset = icc.readUInt32BE(entry + 4);
      const size = icc.readUInt32BE(entry + 8);
      const name = readDescription(icc.subarray(offset, offset + size));
      if (name) return clean(name);
    }
  } catch {
    // A damaged tag table: the profile is still applied by sharp; only its name is unknown.
  }
  return 'unnamed profile';
}

function readDescription(tag: Buffer): string | null {
  const type = tag.toString('latin1', 0, 4);
  if (type === 'desc') {
    const count = tag.readUInt32BE(8);
    return tag.toString('latin1', 12, 12 + Math.min(count, tag.length - 12)).replace(/\0.*$/s, '');
  }
  if (type === 'mluc') {
    const records = tag.readUInt32BE(8);
    if (records < 1) return null;
    // The first record; phones and libvips write English first.
    const length = tag.readUInt32BE(16 + 4);
    const offset = tag.readUInt32BE(16 + 8);
    const utf16 = tag.subarray(offset, offset + length);
    // UTF-16BE → string: swap to the little-endian order Node decodes.
    const swapped = Buffer.from(utf16.subarray(0, utf16.length - (utf16.length % 2)));
    swapped.swap16();
    return swapped.toString('utf16le');
  }
  return null;
}

function clean(name: string): string {
  const printable = name.replace(/[^\p{L}\p{N}\p{P}\p{Zs}]/gu, '').trim();
  return (printable || 'unnamed profile').slice(0, NAME_MAX);
}
