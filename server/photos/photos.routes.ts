import { Router } from 'express';
import { PHOTO_FIELD, PHOTO_MAX_BYTES, sampleBody } from '../../shared/api/photos.js';
import { actorOf, allow, signedIn } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { receiveOneFile } from '../core/file-upload.js';
import { idParam, parse } from '../core/validate.js';
import { idempotent } from '../idempotency/idempotent.js';
import { findPhotoRow, photoFile, samplePhoto, storePhoto, type MatchColour } from './photos.js';
import { toPhotoDto } from './photo.entity.js';

/**
 * /api/photos. Uploading is for those who take readings or set up calibration specimens
 * (recorder, trainer, admin); everyone signed in may view a photo and sample it, so a reviewer can
 * re-measure the region a reading was taken from. Files live under `<dataDir>/photos/`.
 */
export function photoRoutes(ctx: AppContext): Router {
  const router = Router();
  const files = ctx.photos;
  if (files === null) {
    router.use((_req, _res, next) => next(new AppError(503, 'Photos unavailable', 'This server was started without a data folder for photos.', undefined, 'no-photo-storage')));
    return router;
  }
  const match: MatchColour = (lab, k) => ctx.referenceSets.match(lab, k);

  router.post('/', allow('recorder', 'trainer', 'admin'), receivePhoto, idempotent(ctx), async (req, res) => {
    if (!req.file) throw AppError.badRequest(`Send the photo as multipart/form-data in the field "${PHOTO_FIELD}".`, [{ field: PHOTO_FIELD, message: 'no file' }]);
    const { photo, created } = await storePhoto(ctx.ds, files, actorOf(req), req.file.buffer);
    res.status(created ? 201 : 200).location(`/api/photos/${photo.id}`).json(photo);
  });

  router.get('/:id', signedIn, async (req, res) => {
    res.json(toPhotoDto(await findPhotoRow(ctx.ds, idParam(req.params['id']))));
  });

  for (const [route, which] of [['/:id/image', 'display'], ['/:id/thumb', 'thumb']] as const) {
    router.get(route, signedIn, async (req, res) => {
      const file = await photoFile(ctx.ds, files, idParam(req.params['id']), which);
      // A photo's files never change (they are named by content hash), so the browser may keep them.
      res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
      res.type('image/jpeg').sendFile(file.path, { etag: false, lastModified: false, headers: { ETag: `"${file.sha256.slice(0, 32)}-${which}"` } });
    });
  }

  router.post('/:id/sample', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await samplePhoto(ctx.ds, files, match, id, parse(sampleBody, req.body)));
  });

  return router;
}

/** One photo of at most 25 MB; its refusals become problem+json. */
const receivePhoto = receiveOneFile({
  field: PHOTO_FIELD,
  maxBytes: PHOTO_MAX_BYTES,
  fields: 4,
  parts: 6,
  what: 'the photo',
  tooLarge: `The photo is larger than ${PHOTO_MAX_BYTES / 1024 / 1024} MB. Use the camera's normal photo size.`,
  oneFile: `Send one photo, in the field "${PHOTO_FIELD}".`,
});
