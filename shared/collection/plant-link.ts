/*
 * The address a plant label's QR code carries (`…/record/plant/ID`) and how a scan is read back.
 * Only the path matters: a label printed for one server address still opens the plant on another
 * (a laptop in the field office, a tunnel), so the origin in the code is not checked.
 */

/** The plant id in a scanned text that is a plant sheet address, or null for anything else. */
export function plantIdFromScan(text: string): number | null {
  const m = /(?:^|\/)record\/plant\/(\d+)(?:[/?#]|$)/.exec(text.trim());
  if (!m) return null;
  const id = Number(m[1]);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
