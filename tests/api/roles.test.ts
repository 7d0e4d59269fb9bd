import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { ROLES, type Role } from '../../shared/api/auth.js';
import type { AccessRule } from '../../server/core/access.js';
import { Site } from '../../server/collection/site.entity.js';
import { Notification } from '../../server/reviews/review.entity.js';
import { Certification } from '../../server/calibration/certification.entity.js';
import { listApiRoutes } from './api-routes.js';
import { assertBrapiError, assertProblem } from './assert-problem.js';
import { addUser, Client, mailsTo, PASSWORD, rowCounts, signedInAs, startHarness, tokenFromLink, type Harness } from './harness.js';
import { fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';

/** What the table's requests need: tokens from real mails, ids of real rows, unique names. */
interface Fixtures {
  viewToken: string;
  acceptToken: string;
  resetToken: string;
  patchTargetId: number;
  messageId: number;
  siteId: number;
  /** A stored photo, and new photo bytes for each upload. */
  photoId: number;
  nextPhoto(): Buffer;
  /** An open, unrestricted calibration session with one specimen; a closed one; a user to invite. */
  calibrationSessionId: number;
  calibrationSpecimenId: number;
  closedCalibrationSessionId: number;
  calibrationInviteeId: number;
  /** A fresh open session for each close request. */
  nextClosableSession(): number;
  /** A fresh number for unique e-mails and accession numbers. */
  next(): number;
  /** Collection management: a demo accession and plant, a character, a length descriptor. */
  accessionId: number;
  plantId: number;
  characterId: number;
  descriptorId: number;
  /** The whole walk order as it stands, for the reorder request. */
  walkOrderItems: { kind: string; id: number }[];
  /** A current observation entered by the role (recorders and trainers correct only their own). */
  observationBy(role?: Role): number;
  /** Readings: a body that creates one, a reading to open, a fresh reading of the role for each correction, an import file. */
  readingBody(): object;
  readingId: number;
  readingBy(role?: Role): number;
  readingsCsv(): Buffer;
  /** Reviews: a demo recorder's reading in force (nobody in the table took it), and a notice of each role's own user. */
  reviewTargetId: number;
  noticeOf(role?: Role): number;
  /** A certification of each role's own user (its PDF is theirs to fetch). */
  certificateOf(role?: Role): number;
  /** A BrAPI token to revoke (revoking twice answers the same row). */
  apiTokenId: number;
  /** A print batch of v1's card, to read and to add measured patches to. */
  printBatchId: number;
}

/** One API route: who may call it and a request that succeeds for them. */
interface RouteCase {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT';
  /** The path pattern as the app mounts it. */
  path: string;
  access: 'public' | readonly Role[];
  /** The status an admitted caller gets for the request below. */
  ok: number;
  /** The URL; `role` is the caller's, for fixtures that must belong to them. */
  url?: (f: Fixtures, role?: Role) => string;
  body?: (f: Fixtures) => object;
  /** A multipart upload in the field `photo` instead of a JSON body. */
  upload?: (f: Fixtures) => Buffer;
  /** A multipart upload in the field `file` (a CSV) instead of a JSON body. */
  csv?: (f: Fixtures) => Buffer;
}

const EVERYONE = ROLES;
const ADMIN: readonly Role[] = ['admin'];
const OBSERVERS: readonly Role[] = ['recorder', 'trainer', 'admin'];
const TRAINERS: readonly Role[] = ['trainer', 'admin'];
const REVIEWERS: readonly Role[] = ['reviewer', 'admin'];

/** Every API route (docs/architecture.md, roles); the first test checks the app has no others. */
const ROUTES: readonly RouteCase[] = [
  { method: 'GET', path: '/api/health', access: 'public', ok: 200 },
  { method: 'POST', path: '/api/auth/login', access: 'public', ok: 200, body: () => ({ email: 'login@test.example', password: PASSWORD }) },
  // Signing out is open to anyone, so a client whose session has already lapsed can still sign out cleanly.
  { method: 'POST', path: '/api/auth/logout', access: 'public', ok: 204 },
  { method: 'GET', path: '/api/auth/me', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/auth/password', access: EVERYONE, ok: 204, body: () => ({ currentPassword: PASSWORD, newPassword: 'a-new-long-passphrase' }) },
  { method: 'POST', path: '/api/auth/password-reset', access: 'public', ok: 202, body: (f) => ({ email: `someone-${f.next()}@test.example` }) },
  { method: 'POST', path: '/api/auth/password-reset/confirm', access: 'public', ok: 204, body: (f) => ({ token: f.resetToken, password: 'a-new-long-passphrase' }) },
  { method: 'GET', path: '/api/invitations', access: ADMIN, ok: 200 },
  { method: 'POST', path: '/api/invitations', access: ADMIN, ok: 201, body: (f) => ({ email: `invitee-${f.next()}@test.example`, name: 'Invitee', role: 'recorder' }) },
  { method: 'GET', path: '/api/invitations/:token', access: 'public', ok: 200, url: (f) => `/api/invitations/${f.viewToken}` },
  { method: 'POST', path: '/api/invitations/accept', access: 'public', ok: 201, body: (f) => ({ token: f.acceptToken, password: 'a-new-long-passphrase' }) },
  { method: 'GET', path: '/api/users', access: ADMIN, ok: 200 },
  { method: 'POST', path: '/api/users', access: ADMIN, ok: 201, body: (f) => ({ email: `made-${f.next()}@test.example`, name: 'Made', role: 'reviewer', password: 'a-new-long-passphrase' }) },
  { method: 'PATCH', path: '/api/users/:id', access: ADMIN, ok: 200, url: (f) => `/api/users/${f.patchTargetId}`, body: (f) => ({ name: `Renamed ${f.next()}` }) },
  { method: 'GET', path: '/api/outbox', access: ADMIN, ok: 200 },
  { method: 'GET', path: '/api/outbox/:id', access: ADMIN, ok: 200, url: (f) => `/api/outbox/${f.messageId}` },
  { method: 'GET', path: '/api/audit', access: ADMIN, ok: 200 },
  { method: 'GET', path: '/api/sites', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/characters', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/accessions', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/accessions', access: ADMIN, ok: 201, body: (f) => ({ accessionNumber: `RT-${f.next()}`, name: 'Matrix Test', siteId: f.siteId }) },
  { method: 'POST', path: '/api/sites', access: ADMIN, ok: 201, body: (f) => ({ code: `RT${f.next()}`, name: 'Matrix Plot', timezone: 'Pacific/Fiji', seasons: [{ name: 'All year', start: '01-01', end: '12-31' }] }) },
  { method: 'PATCH', path: '/api/sites/:id', access: ADMIN, ok: 200, url: (f) => `/api/sites/${f.siteId}`, body: (f) => ({ name: `Renamed plot ${f.next()}` }) },
  { method: 'PUT', path: '/api/sites/:id/seasons', access: ADMIN, ok: 200, url: (f) => `/api/sites/${f.siteId}/seasons`, body: () => ({ seasons: [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }] }) },
  // Before any row adds to the catalogue: the reorder names every entry the fixtures saw.
  { method: 'GET', path: '/api/catalogue/order', access: EVERYONE, ok: 200 },
  { method: 'PUT', path: '/api/catalogue/order', access: ADMIN, ok: 200, body: (f) => ({ items: f.walkOrderItems }) },
  { method: 'POST', path: '/api/characters', access: ADMIN, ok: 201, body: (f) => ({ code: `matrix.test${f.next()}`, organ: 'leaf', label: 'Matrix character', howToRead: 'Read it the way the matrix test says.' }) },
  { method: 'PATCH', path: '/api/characters/:id', access: ADMIN, ok: 200, url: (f) => `/api/characters/${f.characterId}`, body: (f) => ({ driftThreshold: 1 + f.next() / 100 }) },
  { method: 'GET', path: '/api/accessions/mcpd.csv', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/accessions/:id', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}` },
  { method: 'PATCH', path: '/api/accessions/:id', access: ADMIN, ok: 200, url: (f) => `/api/accessions/${f.accessionId}`, body: (f) => ({ remarks: `Matrix remark ${f.next()}` }) },
  { method: 'POST', path: '/api/accessions/:id/plants', access: ADMIN, ok: 201, url: (f) => `/api/accessions/${f.accessionId}/plants`, body: (f) => ({ label: `RT${f.next()}`, plantedOn: '2025-06-01' }) },
  { method: 'PATCH', path: '/api/plants/:id', access: ADMIN, ok: 200, url: (f) => `/api/plants/${f.plantId}`, body: (f) => ({ plantedOn: `2025-01-${String(10 + (f.next() % 18)).padStart(2, '0')}` }) },
  { method: 'GET', path: '/api/accessions/:id/descriptors', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}/descriptors` },
  { method: 'GET', path: '/api/accessions/:id/profile', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}/profile` },
  { method: 'GET', path: '/api/accessions/:id/similar', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}/similar` },
  { method: 'GET', path: '/api/accessions/duplicates', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/accessions/characterisation.xlsx', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/accessions/:id/profile.pdf', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}/profile.pdf` },
  { method: 'GET', path: '/api/descriptors', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/descriptors', access: ADMIN, ok: 201, body: (f) => ({ code: `matrix.length${f.next()}`, label: 'Matrix length', object: 'matrix part', kind: 'length', howToMeasure: 'Measure it the way the matrix test says.' }) },
  { method: 'PATCH', path: '/api/descriptors/:id', access: ADMIN, ok: 200, url: (f) => `/api/descriptors/${f.descriptorId}`, body: (f) => ({ object: `matrix part ${f.next()}` }) },
  { method: 'GET', path: '/api/observations', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/observations', access: OBSERVERS, ok: 201, body: (f) => ({ accessionId: f.accessionId, plantId: f.plantId, descriptorId: f.descriptorId, value: 40, unit: 'in' }) },
  { method: 'POST', path: '/api/observations/batch', access: OBSERVERS, ok: 201, body: (f) => ({ observations: [{ accessionId: f.accessionId, plantId: f.plantId, descriptorId: f.descriptorId, value: 41, unit: 'in' }] }) },
  { method: 'POST', path: '/api/observations/:id/supersede', access: OBSERVERS, ok: 201, url: (f, role) => `/api/observations/${f.observationBy(role)}/supersede`, body: () => ({ value: 101.6, unit: 'cm' }) },
  { method: 'GET', path: '/api/account/preferences', access: EVERYONE, ok: 200 },
  { method: 'PUT', path: '/api/account/preferences', access: EVERYONE, ok: 200, body: (f) => ({ unitSystem: f.next() % 2 ? 'imperial' : 'metric' }) },
  { method: 'GET', path: '/api/plants/labels.pdf', access: EVERYONE, ok: 200, url: (f) => `/api/plants/labels.pdf?accessionId=${f.accessionId}` },
  { method: 'GET', path: '/api/plants/:id/sheet', access: EVERYONE, ok: 200, url: (f) => `/api/plants/${f.plantId}/sheet` },
  { method: 'POST', path: '/api/plants/:id/skips', access: OBSERVERS, ok: 201, url: (f) => `/api/plants/${f.plantId}/skips`, body: (f) => ({ characterId: f.characterId, reason: `Matrix skip ${f.next()}` }) },
  { method: 'GET', path: '/api/accessions/:id/progress', access: EVERYONE, ok: 200, url: (f) => `/api/accessions/${f.accessionId}/progress` },
  { method: 'GET', path: '/api/progress', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/reference-sets', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/reference-sets/:id/chips', access: EVERYONE, ok: 200, url: () => '/api/reference-sets/v1/chips' },
  { method: 'GET', path: '/api/reference-sets/:id/card.pdf', access: EVERYONE, ok: 200, url: () => '/api/reference-sets/v1/card.pdf' },
  { method: 'GET', path: '/api/reference-sets/:id/booklet.pdf', access: EVERYONE, ok: 200, url: () => '/api/reference-sets/v1/booklet.pdf' },
  { method: 'PUT', path: '/api/reference-sets/current', access: ADMIN, ok: 200, body: () => ({ setId: 'v1' }) },
  { method: 'POST', path: '/api/match', access: EVERYONE, ok: 200, body: () => ({ hex: '#7b3f6e' }) },
  { method: 'POST', path: '/api/photos', access: ['recorder', 'trainer', 'admin'], ok: 201, upload: (f) => f.nextPhoto() },
  { method: 'GET', path: '/api/photos/:id', access: EVERYONE, ok: 200, url: (f) => `/api/photos/${f.photoId}` },
  { method: 'GET', path: '/api/photos/:id/image', access: EVERYONE, ok: 200, url: (f) => `/api/photos/${f.photoId}/image` },
  { method: 'GET', path: '/api/photos/:id/thumb', access: EVERYONE, ok: 200, url: (f) => `/api/photos/${f.photoId}/thumb` },
  { method: 'POST', path: '/api/photos/:id/sample', access: EVERYONE, ok: 200, url: (f) => `/api/photos/${f.photoId}/sample`, body: () => ({ region: { shape: 'rect', x: 2, y: 2, width: 8, height: 8 } }) },
  { method: 'GET', path: '/api/calibration/sessions', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/calibration/sessions', access: TRAINERS, ok: 201, body: (f) => ({ title: `Matrix session ${f.next()}` }) },
  { method: 'GET', path: '/api/calibration/sessions/:id', access: EVERYONE, ok: 200, url: (f) => `/api/calibration/sessions/${f.calibrationSessionId}` },
  { method: 'POST', path: '/api/calibration/sessions/:id/specimens', access: TRAINERS, ok: 201, url: (f) => `/api/calibration/sessions/${f.calibrationSessionId}/specimens`, body: (f) => ({ label: `Specimen ${f.next()}`, chipCode: 'F-092' }) },
  { method: 'POST', path: '/api/calibration/sessions/:id/participants', access: TRAINERS, ok: 200, url: (f) => `/api/calibration/sessions/${f.calibrationSessionId}/participants`, body: (f) => ({ userIds: [f.calibrationInviteeId] }) },
  { method: 'POST', path: '/api/calibration/sessions/:id/responses', access: EVERYONE, ok: 201, url: (f) => `/api/calibration/sessions/${f.calibrationSessionId}/responses`, body: (f) => ({ specimenId: f.calibrationSpecimenId, chipCode: 'F-092.076' }) },
  { method: 'POST', path: '/api/calibration/sessions/:id/close', access: TRAINERS, ok: 200, url: (f) => `/api/calibration/sessions/${f.nextClosableSession()}/close` },
  { method: 'GET', path: '/api/calibration/sessions/:id/results', access: TRAINERS, ok: 200, url: (f) => `/api/calibration/sessions/${f.calibrationSessionId}/results` },
  { method: 'GET', path: '/api/calibration/sessions/:id/results/me', access: EVERYONE, ok: 200, url: (f) => `/api/calibration/sessions/${f.closedCalibrationSessionId}/results/me` },
  { method: 'GET', path: '/api/calibration/certifications', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/calibration/certifications/:id/certificate.pdf', access: EVERYONE, ok: 200, url: (f, role) => `/api/calibration/certifications/${f.certificateOf(role)}/certificate.pdf` },
  { method: 'GET', path: '/api/calibration/standings', access: TRAINERS, ok: 200 },
  { method: 'GET', path: '/api/calibration/screenings', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/calibration/screenings', access: EVERYONE, ok: 201, body: () => ({ screenedOn: '2026-01-05', method: 'other', result: 'normal' }) },
  { method: 'GET', path: '/api/readings', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/readings', access: OBSERVERS, ok: 201, body: (f) => f.readingBody() },
  { method: 'POST', path: '/api/readings/batch', access: OBSERVERS, ok: 201, body: (f) => ({ readings: [f.readingBody()] }) },
  { method: 'GET', path: '/api/readings/export.csv', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/readings/export.xlsx', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/readings/import', access: OBSERVERS, ok: 201, csv: (f) => f.readingsCsv() },
  { method: 'GET', path: '/api/readings/:id', access: EVERYONE, ok: 200, url: (f) => `/api/readings/${f.readingId}` },
  { method: 'POST', path: '/api/readings/:id/supersede', access: OBSERVERS, ok: 201, url: (f, role) => `/api/readings/${f.readingBy(role)}/supersede`, body: (f) => ({ ...f.readingBody(), reason: 'matrix correction' }) },
  { method: 'POST', path: '/api/readings/:id/review', access: REVIEWERS, ok: 201, url: (f) => `/api/readings/${f.reviewTargetId}/review`, body: () => ({ decision: 'approve' }) },
  { method: 'GET', path: '/api/readings/:id/reviews', access: EVERYONE, ok: 200, url: (f) => `/api/readings/${f.reviewTargetId}/reviews` },
  { method: 'GET', path: '/api/reviews/queue', access: REVIEWERS, ok: 200 },
  { method: 'POST', path: '/api/reviews/approve', access: REVIEWERS, ok: 200, body: (f) => ({ ids: [f.reviewTargetId] }) },
  { method: 'GET', path: '/api/notifications', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/notifications/:id/read', access: EVERYONE, ok: 204, url: (f, role) => `/api/notifications/${f.noticeOf(role)}/read` },
  { method: 'GET', path: '/api/analysis/overview', access: EVERYONE, ok: 200 },
  { method: 'GET', path: '/api/analysis/drift', access: EVERYONE, ok: 200, url: (f) => `/api/analysis/drift?accessionId=${f.accessionId}&characterId=${f.characterId}` },
  { method: 'GET', path: '/api/analysis/sites', access: EVERYONE, ok: 200, url: (f) => `/api/analysis/sites?accessionId=${f.accessionId}&characterId=${f.characterId}` },
  { method: 'GET', path: '/api/print-batches', access: EVERYONE, ok: 200 },
  { method: 'POST', path: '/api/print-batches', access: ADMIN, ok: 201, body: () => ({ setId: 'v2', kind: 'booklet', printedOn: '2026-02-01', note: 'Matrix printer, gloss paper' }) },
  { method: 'GET', path: '/api/print-batches/:id', access: EVERYONE, ok: 200, url: (f) => `/api/print-batches/${f.printBatchId}` },
  { method: 'POST', path: '/api/print-batches/:id/patches', access: ADMIN, ok: 201, url: (f) => `/api/print-batches/${f.printBatchId}/patches`, body: (f) => ({ patches: [{ chipCode: `F-${String(1 + (f.next() % 189)).padStart(3, '0')}`, lab: [50, 10, 10] }] }) },
  { method: 'GET', path: '/api/api-tokens', access: ADMIN, ok: 200 },
  { method: 'POST', path: '/api/api-tokens', access: ADMIN, ok: 201, body: (f) => ({ userId: f.patchTargetId, label: `Matrix token ${f.next()}` }) },
  { method: 'POST', path: '/api/api-tokens/:id/revoke', access: ADMIN, ok: 200, url: (f) => `/api/api-tokens/${f.apiTokenId}/revoke` },
  // The read-only BrAPI interface: every role reads; refusals are BrAPI's error string, not problem+json.
  ...['serverinfo', 'commoncropnames', 'germplasm', 'locations', 'seasons', 'observationunits', 'variables', 'observations', 'images'].map(
    (call): RouteCase => ({ method: 'GET', path: `/brapi/v2/${call}`, access: EVERYONE, ok: 200 }),
  ),
  { method: 'GET', path: '/brapi/v2/germplasm/:germplasmDbId', access: EVERYONE, ok: 200, url: (f) => `/brapi/v2/germplasm/${f.accessionId}` },
  { method: 'GET', path: '/brapi/v2/images/:imageDbId', access: EVERYONE, ok: 200, url: (f) => `/brapi/v2/images/${f.photoId}` },
  { method: 'GET', path: '/brapi/v2/images/:imageDbId/imagecontent', access: EVERYONE, ok: 200, url: (f) => `/brapi/v2/images/${f.photoId}/imagecontent` },
];

/** Calibration sessions for the table: an open one with a specimen, a closed one, and a pool to close. */
async function calibrationFixtures(admin: Client, inviteeId: number) {
  const create = async (title: string) => (await admin.post('/api/calibration/sessions', { title }).expect(201)).body.id as number;
  const calibrationSessionId = await create('Matrix open session');
  const specimen = await admin.post(`/api/calibration/sessions/${calibrationSessionId}/specimens`, { label: 'Matrix specimen', lab: [50, -16, 13] }).expect(201);
  const closedCalibrationSessionId = await create('Matrix closed session');
  await admin.post(`/api/calibration/sessions/${closedCalibrationSessionId}/close`).expect(200);
  // One per request of the close row (six roles' requests at most, refused ones included).
  const closable: number[] = [];
  for (let i = 0; i < 6; i++) closable.push(await create(`Matrix closable ${i}`));
  return { calibrationSessionId, calibrationSpecimenId: specimen.body.id as number, closedCalibrationSessionId, calibrationInviteeId: inviteeId, nextClosableSession: () => closable.pop()! };
}

/** Ids for the collection-management rows, and one observation of each observing role to correct. */
async function collectionFixtures(clients: Map<Role, Client>): Promise<Pick<Fixtures, 'accessionId' | 'plantId' | 'characterId' | 'descriptorId' | 'observationBy' | 'walkOrderItems'>> {
  const admin = clients.get('admin')!;
  const accession = (await admin.get('/api/accessions').expect(200)).body[0] as { id: number; plants: { id: number }[] };
  const characterId = ((await admin.get('/api/characters').expect(200)).body[0] as { id: number }).id;
  const descriptorId = ((await admin.get('/api/descriptors').expect(200)).body as { id: number; code: string }[]).find((d) => d.code === 'petiole.length')!.id;
  const own = new Map<Role, number>();
  for (const role of OBSERVERS) {
    const res = await clients.get(role)!.post('/api/observations', { accessionId: accession.id, plantId: accession.plants[0]!.id, descriptorId, value: 4, unit: 'in' }).expect(201);
    own.set(role, res.body.id as number);
  }
  const walkOrderItems = ((await admin.get('/api/catalogue/order').expect(200)).body as { kind: string; id: number }[]).map((e) => ({ kind: e.kind, id: e.id }));
  return { walkOrderItems, accessionId: accession.id, plantId: accession.plants[0]!.id, characterId, descriptorId, observationBy: (role) => own.get(role ?? 'admin') ?? own.get('admin')! };
}

/** Readings for the table: one of each observing role per correction request (a corrected reading cannot be corrected again). */
async function readingFixtures(clients: Map<Role, Client>): Promise<Pick<Fixtures, 'readingBody' | 'readingId' | 'readingBy' | 'readingsCsv'>> {
  const admin = clients.get('admin')!;
  const accession = (await admin.get('/api/accessions').expect(200)).body[0] as { id: number; accessionNumber: string };
  const character = ((await admin.get('/api/characters').expect(200)).body as { id: number; code: string }[]).find((c) => c.code === 'petiole.third.upper')!;
  const readingBody = () => ({ accessionId: accession.id, characterId: character.id, method: 'instrument', lab: [40, 22, -9], light: 'overcast' });
  const own = new Map<Role, number[]>();
  for (const role of OBSERVERS) {
    const ids: number[] = [];
    // The admin's pool also serves the refused callers' requests, which correct nothing but still take one.
    for (let i = 0; i < (role === 'admin' ? 4 : 1); i++) ids.push((await clients.get(role)!.post('/api/readings', readingBody()).expect(201)).body.id as number);
    own.set(role, ids);
  }
  const csv = `accessionNumber,characterCode,observedAt,L,a,b,light\r\n${accession.accessionNumber},${character.code},2026-02-10T09:30:00+12:00,41,21,-8,overcast\r\n`;
  return { readingBody, readingId: own.get('admin')![0]!, readingBy: (role) => (own.get(role ?? 'admin') ?? own.get('admin')!).pop()!, readingsCsv: () => Buffer.from(csv, 'utf8') };
}

/** One certification of each role's own user, put straight in the table on the closed fixture session. */
async function certificateFixtures(h: Harness, clients: Map<Role, Client>, sessionId: number): Promise<Pick<Fixtures, 'certificateOf'>> {
  const certs = new Map<Role, number>();
  for (const role of ROLES) {
    const me = (await clients.get(role)!.get('/api/auth/me').expect(200)).body as { user: { id: number } };
    const saved = await h.ds.getRepository(Certification).save({ user: { id: me.user.id }, session: { id: sessionId }, referenceSetId: 'v1', certifiedOn: '2026-01-05', kappa: 0.8, meanDeltaE00: 1.1, n: 3, kappaThreshold: 0.61, deltaE00Threshold: 1.8 });
    certs.set(role, saved.id);
  }
  return { certificateOf: (role) => certs.get(role ?? 'admin')! };
}

/** Reviews for the table: a demo recorder's reading to decide on, and one notice of each role's user, put straight in the table (a reviewer takes no readings, so could get none through the API). */
async function reviewFixtures(h: Harness, clients: Map<Role, Client>): Promise<Pick<Fixtures, 'reviewTargetId' | 'noticeOf'>> {
  const [target] = (await h.ds.query(`SELECT r."id" FROM "reading" r JOIN "user" u ON u."id" = r."observerId" WHERE u."email" = 'recorder@demo.test' AND r."supersededById" IS NULL ORDER BY r."id" LIMIT 1`)) as { id: number }[];
  assert.ok(target, 'the demo has a reading by the demo recorder');
  const notices = new Map<Role, number>();
  for (const role of ROLES) {
    const me = (await clients.get(role)!.get('/api/auth/me').expect(200)).body as { user: { id: number } };
    const saved = await h.ds.getRepository(Notification).save({ userId: me.user.id, kind: 'reading-flagged', readingId: target.id, message: 'Matrix notice.', readAt: null });
    notices.set(role, saved.id);
  }
  return { reviewTargetId: target.id, noticeOf: (role) => notices.get(role ?? 'admin')! };
}

function send(client: Client, route: RouteCase, f: Fixtures, role?: Role) {
  const url = route.url?.(f, role) ?? route.path;
  if (route.upload) return uploadPhoto(client, route.upload(f), 'leaf.png', 'image/png');
  if (route.csv) return client.raw('post', url).attach('file', route.csv(f), { filename: 'readings.csv', contentType: 'text/csv' });
  if (route.method === 'GET') return client.get(url);
  if (route.method === 'PATCH') return client.patch(url, route.body?.(f));
  if (route.method === 'PUT') return client.put(url, route.body?.(f));
  return client.post(url, route.body?.(f));
}

/** Row counts and the user table: a refused request must change neither. */
async function snapshot(h: Harness): Promise<string> {
  return JSON.stringify([await rowCounts(h.ds), await h.ds.query('SELECT id, email, name, role, active, passwordHash FROM "user" ORDER BY id')]);
}

function article(word: string): string {
  return /^[aeiou]/.test(word) ? 'an' : 'a';
}

function ruleOf(route: RouteCase): AccessRule {
  return route.access === 'public' ? { public: true } : { public: false, roles: route.access };
}

describe('who may call each API route', () => {
  let h: Harness;
  let f: Fixtures;
  const clients = new Map<Role, Client>();

  before(async () => {
    h = await startHarness({ demo: true });
    const signedIn = await Promise.all(ROLES.map((role) => signedInAs(h, role)));
    ROLES.forEach((role, i) => clients.set(role, signedIn[i]!));
    const admin = clients.get('admin')!;
    let n = 0;
    const next = () => ++n;
    await addUser(h.ds, 'recorder', 'login@test.example');
    const target = await addUser(h.ds, 'recorder', 'target@test.example');
    const forgetful = await addUser(h.ds, 'trainer', 'forgetful@test.example');

    await admin.post('/api/invitations', { email: 'viewer@test.example', name: 'Viewer', role: 'trainer' }).expect(201);
    await admin.post('/api/invitations', { email: 'accepter@test.example', name: 'Accepter', role: 'reviewer' }).expect(201);
    const [viewMail] = await mailsTo(h.ds, 'viewer@test.example');
    const [acceptMail] = await mailsTo(h.ds, 'accepter@test.example');
    await (await new Client(h.app).prime()).post('/api/auth/password-reset', { email: forgetful.email }).expect(202);
    const [resetMail] = await mailsTo(h.ds, forgetful.email);
    assert.ok(viewMail && acceptMail && resetMail, 'the fixture mails arrived');
    // One photo for the viewing routes, and one each for the roles that may upload.
    const photos = await Promise.all([1, 2, 3, 4, 5, 6].map((n) => fromRaw(paintScene(16, 16, [40 * n, 90, 150], []), 16, 16).png().toBuffer()));

    f = {
      viewToken: tokenFromLink(viewMail.text, 'invitation'),
      acceptToken: tokenFromLink(acceptMail.text, 'invitation'),
      resetToken: tokenFromLink(resetMail.text, 'reset-password'),
      patchTargetId: target.id,
      messageId: viewMail.id,
      siteId: (await h.ds.getRepository(Site).find({ take: 1 }))[0]!.id,
      photoId: (await uploadPhoto(admin, photos.pop()!, 'leaf.png', 'image/png').expect(201)).body.id,
      nextPhoto: () => photos.pop()!,
      ...(await calibrationFixtures(admin, target.id)),
      next,
      ...(await collectionFixtures(clients)),
      ...(await readingFixtures(clients)),
      ...(await reviewFixtures(h, clients)),
      certificateOf: () => 0,
      apiTokenId: (await admin.post('/api/api-tokens', { userId: target.id, label: 'Matrix token' }).expect(201)).body.id as number,
      printBatchId: (await admin.post('/api/print-batches', { setId: 'v1', kind: 'card', printedOn: '2026-01-05', note: 'Matrix printer, matt paper' }).expect(201)).body.id as number,
    };
    Object.assign(f, await certificateFixtures(h, clients, f.closedCalibrationSessionId));
  });
  after(() => h.close());

  test('should have every mounted API route in the table, each with exactly the access rule the table gives', () => {
    const mounted = listApiRoutes(h.app);
    const key = (r: { method: string; path: string }) => `${r.method} ${r.path}`;
    assert.deepEqual(mounted.map(key).sort(), ROUTES.map(key).sort());
    for (const route of mounted) {
      assert.equal(route.rules.length, 1, `${key(route)} carries exactly one access rule (allow() or publicRoute)`);
      const expected = ROUTES.find((r) => key(r) === key(route))!;
      assert.deepEqual(route.rules[0], ruleOf(expected), key(route));
    }
  });

  for (const route of ROUTES) {
    describe(`${route.method} ${route.path}`, () => {
      if (route.access === 'public') {
        test(`should answer ${route.ok} when signed out`, async () => {
          const res = await send(await new Client(h.app).prime(), route, f);
          assert.equal(res.status, route.ok, res.text);
        });
        return;
      }
      const allowed = route.access;

      test('should answer 401 when signed out (problem+json, or BrAPI\'s error under /brapi), changing nothing', async () => {
        const before = await snapshot(h);
        const res = await send(await new Client(h.app).prime(), route, f);
        if (route.path.startsWith('/brapi/')) assertBrapiError(res, 401);
        else assertProblem(res, 401);
        assert.equal(await snapshot(h), before);
      });

      for (const role of ROLES) {
        if (allowed.includes(role)) {
          test(`should let ${article(role)} ${role} in (${route.ok})`, async () => {
            const res = await send(clients.get(role)!, route, f, role);
            assert.equal(res.status, route.ok, res.text);
          });
        } else {
          test(`should refuse ${article(role)} ${role} with 403 problem+json, changing nothing`, async () => {
            const before = await snapshot(h);
            assertProblem(await send(clients.get(role)!, route, f), 403);
            assert.equal(await snapshot(h), before);
          });
        }
      }
    });
  }
});
