import { Router, type Request, type RequestHandler } from 'express';
import { signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { photoFile } from '../photos/photos.js';
import { APP_VERSION } from '../version.js';
import { bearerAuth, crossOrigin, readOnly } from './brapi-auth.js';
import { commonCropNames, findGermplasm, findLocations, findObservationUnits, findSeasons, getGermplasm, numericId } from './brapi-collection.js';
import { BRAPI_VERSION, BrapiError, brapiErrorHandler, listAnswer, oneParam, pageOf, pageRequest, singleAnswer, timeParam } from './brapi-envelope.js';
import { findImages } from './brapi-images.js';
import { findObservations } from './brapi-observations.js';
import { findVariables } from './brapi-variables.js';

/** One BrAPI call: its name as the specification spells it (path parameters in braces) and its handler. */
interface Call {
  service: string;
  /** Whether it answers JSON (the image content is a JPEG). */
  json: boolean;
  handle: RequestHandler;
}

/** An optional whole-number year parameter; 400 in BrAPI's form when it is not one. */
function yearParam(req: Request): number | undefined {
  const raw = oneParam(req, 'year');
  if (raw === undefined) return undefined;
  if (!/^\d{4}$/.test(raw)) throw new BrapiError(400, `Invalid query parameter year: must be a 4-digit year (got "${raw.slice(0, 40)}")`);
  return Number(raw);
}

function calls(ctx: AppContext): Call[] {
  const files = ctx.photos;
  const list: Call[] = [
    {
      service: 'serverinfo',
      json: true,
      handle: (req, res) => {
        const contentType = oneParam(req, 'contentType') ?? oneParam(req, 'dataType');
        const served = list.filter((c) => contentType === undefined || (c.json && contentType === 'application/json'));
        res.json(
          singleAnswer({
            serverName: 'Hueledger',
            serverDescription: `Hueledger ${APP_VERSION}: colour characterisation of taro (Colocasia esculenta) accessions. Read-only BrAPI v${BRAPI_VERSION}; CIELAB values use the D65 white and the 2° observer.`,
            calls: served.map((c) => ({
              service: c.service,
              methods: ['GET'],
              versions: [BRAPI_VERSION],
              ...(c.json ? { contentTypes: ['application/json'], dataTypes: ['application/json'] } : {}),
            })),
          }),
        );
      },
    },
    {
      service: 'commoncropnames',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        res.json(pageOf(await commonCropNames(ctx.ds), page));
      },
    },
    {
      service: 'germplasm',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        const filter = Object.fromEntries(['germplasmDbId', 'germplasmName', 'accessionNumber', 'commonCropName', 'germplasmPUI'].map((n) => [n, oneParam(req, n)]));
        res.json(pageOf(await findGermplasm(ctx.ds, filter), page));
      },
    },
    {
      service: 'germplasm/{germplasmDbId}',
      json: true,
      handle: async (req, res) => {
        res.json(singleAnswer(await getGermplasm(ctx.ds, String(req.params['germplasmDbId']))));
      },
    },
    {
      service: 'locations',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        res.json(pageOf(await findLocations(ctx.ds, { locationDbId: oneParam(req, 'locationDbId'), locationName: oneParam(req, 'locationName') }), page));
      },
    },
    {
      service: 'seasons',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        const filter = { seasonDbId: oneParam(req, 'seasonDbId'), seasonName: oneParam(req, 'seasonName') ?? oneParam(req, 'season'), year: yearParam(req) };
        res.json(pageOf(await findSeasons(ctx.ds, filter), page));
      },
    },
    {
      service: 'observationunits',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        const filter = { observationUnitDbId: oneParam(req, 'observationUnitDbId'), germplasmDbId: oneParam(req, 'germplasmDbId'), locationDbId: oneParam(req, 'locationDbId') };
        res.json(pageOf(await findObservationUnits(ctx.ds, filter), page));
      },
    },
    {
      service: 'variables',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        res.json(pageOf(await findVariables(ctx.ds, { observationVariableDbId: oneParam(req, 'observationVariableDbId'), observationVariableName: oneParam(req, 'observationVariableName') }), page));
      },
    },
    {
      service: 'observations',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        const filter = {
          ...Object.fromEntries(['observationDbId', 'germplasmDbId', 'observationUnitDbId', 'observationVariableDbId', 'seasonDbId', 'locationDbId'].map((n) => [n, oneParam(req, n)])),
          observationTimeStampRangeStart: timeParam(req, 'observationTimeStampRangeStart'),
          observationTimeStampRangeEnd: timeParam(req, 'observationTimeStampRangeEnd'),
        };
        const { data, totalCount } = await findObservations(ctx.ds, filter, page);
        res.json(listAnswer(data, page, totalCount));
      },
    },
    {
      service: 'images',
      json: true,
      handle: async (req, res) => {
        const page = pageRequest(req);
        res.json(pageOf(await findImages(ctx.ds, ctx.publicUrl, { imageDbId: oneParam(req, 'imageDbId'), observationUnitDbId: oneParam(req, 'observationUnitDbId') }), page));
      },
    },
    {
      service: 'images/{imageDbId}',
      json: true,
      handle: async (req, res) => {
        const [image] = await findImages(ctx.ds, ctx.publicUrl, { imageDbId: String(req.params['imageDbId']) });
        if (!image) throw new BrapiError(404, `The requested object imageDbId ${String(req.params['imageDbId']).slice(0, 40)} is not found`);
        res.json(singleAnswer(image));
      },
    },
    {
      service: 'images/{imageDbId}/imagecontent',
      json: false,
      handle: async (req, res) => {
        const id = numericId(String(req.params['imageDbId']));
        if (!id || !files) throw new BrapiError(404, `The requested object imageDbId ${String(req.params['imageDbId']).slice(0, 40)} is not found`);
        const file = await photoFile(ctx.ds, files, id, 'display');
        res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
        res.type('image/jpeg').sendFile(file.path, { etag: false, lastModified: false });
      },
    },
  ];
  return list;
}

/**
 * /brapi/v2: the read-only BrAPI interface. Every call admits any signed-in role, by session or
 * by an API token; other origins may read with a token (CORS); anything but GET is refused; every
 * refusal is BrAPI's error answer.
 */
export function brapiRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(crossOrigin, readOnly, bearerAuth(ctx.ds));
  for (const call of calls(ctx)) {
    router.get(`/${call.service.replace(/\{(\w+)\}/g, ':$1')}`, signedIn, call.handle);
  }
  router.use((req, _res, next) => next(new BrapiError(404, `No BrAPI call GET ${req.path} here; GET /brapi/v2/serverinfo lists the calls served`)));
  router.use(brapiErrorHandler(ctx.logError));
  return router;
}

/** Anything else under /brapi (another version, a typo): BrAPI's 404, or 405 for a write. */
export function brapiFallback(logError: (err: unknown) => void): Router {
  const router = Router();
  router.use(crossOrigin, readOnly);
  router.use((req, _res, next) => next(new BrapiError(404, `No BrAPI call ${req.method} ${req.originalUrl.split('?')[0]!.slice(0, 80)} here; this server speaks BrAPI v${BRAPI_VERSION} under /brapi/v2`)));
  router.use(brapiErrorHandler(logError));
  return router;
}
