import type { Role } from '../../../../shared/api/auth.js';

/** The roles the Record section lets in (its route guard in app.routes.ts names the same ones). */
export const RECORDING_ROLES: readonly Role[] = ['recorder', 'trainer', 'admin'];

/** Whether this role may take readings and descriptors (and so open the plant sheet to fill it in). */
export function mayRecord(role: Role | null | undefined): boolean {
  return !!role && RECORDING_ROLES.includes(role);
}

/**
 * Where a link to a plant's sheet goes for this role: the sheet to fill in under Record for those
 * who record, else the same sheet read-only under Collection, so a reviewer is never turned away.
 */
export function plantSheetPath(role: Role | null | undefined, plantId: number): (string | number)[] {
  return mayRecord(role) ? ['/record/plant', plantId] : ['/collection/plants', plantId];
}
