import type { CreateAccessionBody } from '../../../../../shared/api/collection.js';

/** The passport form as typed: text everywhere except the site and status. */
export interface PassportForm {
  accessionNumber: string;
  name: string;
  otherNames: string;
  siteId: number;
  originCountry: string;
  acquisitionDate: string;
  collectingSite: string;
  /** Decimal degrees and metres as typed; empty when unknown. */
  collectingLatitude: string;
  collectingLongitude: string;
  collectingElevationM: string;
  sampleStatus: number | null;
  instituteCode: string;
  donorName: string;
  remarks: string;
}

/** The passport fields the server takes; genus, species and crop stay as the server holds them (taro by default). */
export type PassportBody = Omit<CreateAccessionBody, 'plants'>;

/** The form as the server takes it: text trimmed, empty optional text as null, other names split on ";" (MCPD's separator). */
export function passportBody(form: PassportForm): PassportBody {
  const orNull = (text: string) => text.trim() || null;
  return {
    accessionNumber: form.accessionNumber.trim(),
    name: form.name.trim(),
    otherNames: form.otherNames.split(';').map((name) => name.trim()).filter(Boolean),
    siteId: form.siteId,
    originCountry: orNull(form.originCountry)?.toUpperCase() ?? null,
    acquisitionDate: orNull(form.acquisitionDate),
    collectingSite: orNull(form.collectingSite),
    collectingLatitude: numberOrNull(form.collectingLatitude),
    collectingLongitude: numberOrNull(form.collectingLongitude),
    collectingElevationM: numberOrNull(form.collectingElevationM),
    sampleStatus: form.sampleStatus,
    instituteCode: orNull(form.instituteCode),
    donorName: orNull(form.donorName),
    remarks: orNull(form.remarks),
  };
}

/** A typed number (a true minus sign or a decimal comma accepted), null when empty; NaN is left for the server to refuse by name. */
function numberOrNull(text: string): number | null {
  const t = text.trim().replace('−', '-').replace(',', '.');
  return t === '' ? null : Number(t);
}
