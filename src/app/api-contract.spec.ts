// The client's API classes send exactly the request types the server parses: each is the z.infer
// of the route's zod schema in shared/api. These checks fail `npm run typecheck` (tsc over the
// specs) when a client method's parameter drifts from the schema; vitest runs them as no-ops.
import type { AdminApi } from './features/admin/data/admin-api';
import type { CalibrationApi } from './features/calibration/data/calibration-api';
import type { CollectionApi } from './shared/collection/collection-api';
import type { DescriptorsApi } from './shared/descriptors/descriptors-api';
import type { ReadingsApi } from './shared/readings/readings-api';
import type { PhotosApi } from './shared/photos/photos-api';
import type { ReferenceSetApi } from './shared/chips/reference-set-api';
import type { ReviewsApi } from './features/review/data/reviews-api';
import type { AuthApi } from './core/auth/auth-api';
import type { AcceptInvitationBody, ChangePasswordBody, ConfirmResetBody, InviteBody, LoginBody, UpdateUserBody } from '../../shared/api/auth.js';
import type { CreateResponseBody, CreateScreeningBody, createSessionBody, CreateSpecimenBody } from '../../shared/api/calibration.js';
import type {
  CreateAccessionBody,
  CreateCharacterBody,
  CreatePlantBody,
  CreateSiteBody,
  UpdateAccessionBody,
  UpdateCharacterBody,
  UpdatePlantBody,
} from '../../shared/api/collection.js';
import type { CreateDescriptorBody, CreateObservationBody, UpdateDescriptorBody } from '../../shared/api/descriptors.js';
import type { SampleBody } from '../../shared/api/photos.js';
import type { CreateReadingBody, ListReadingsQuery, SupersedeReadingBody } from '../../shared/api/readings.js';
import type { MatchBody } from '../../shared/api/reference-sets.js';
import type { ReviewBody } from '../../shared/api/reviews.js';
import type { z } from 'zod';

/** The type of parameter `i` of method `k` of class `C`. */
type Param<C, K extends keyof C, I extends number> = C[K] extends (...args: infer A) => unknown ? A[I] : never;

describe('client API classes and the shared request schemas', () => {
  it('should send auth and admin bodies typed by their schemas', () => {
    expectTypeOf<Param<AuthApi, 'login', 0>>().toEqualTypeOf<LoginBody>();
    expectTypeOf<Param<AuthApi, 'changePassword', 0>>().toEqualTypeOf<ChangePasswordBody>();
    expectTypeOf<Param<AuthApi, 'confirmPasswordReset', 0>>().toEqualTypeOf<ConfirmResetBody>();
    expectTypeOf<Param<AuthApi, 'acceptInvitation', 0>>().toEqualTypeOf<AcceptInvitationBody>();
    expectTypeOf<Param<AdminApi, 'updateUser', 1>>().toEqualTypeOf<UpdateUserBody>();
    expectTypeOf<Param<AdminApi, 'invite', 0>>().toEqualTypeOf<InviteBody>();
  });

  it('should send collection bodies typed by their schemas', () => {
    expectTypeOf<Param<CollectionApi, 'createSite', 0>>().toEqualTypeOf<CreateSiteBody>();
    expectTypeOf<Param<CollectionApi, 'createCharacter', 0>>().toEqualTypeOf<CreateCharacterBody>();
    expectTypeOf<Param<CollectionApi, 'updateCharacter', 1>>().toEqualTypeOf<UpdateCharacterBody>();
    expectTypeOf<Param<CollectionApi, 'createAccession', 0>>().toEqualTypeOf<CreateAccessionBody>();
    expectTypeOf<Param<CollectionApi, 'updateAccession', 1>>().toEqualTypeOf<UpdateAccessionBody>();
    expectTypeOf<Param<CollectionApi, 'addPlant', 1>>().toEqualTypeOf<CreatePlantBody>();
    expectTypeOf<Param<CollectionApi, 'updatePlant', 1>>().toEqualTypeOf<UpdatePlantBody>();
    expectTypeOf<Param<DescriptorsApi, 'createDescriptor', 0>>().toEqualTypeOf<CreateDescriptorBody>();
    expectTypeOf<Param<DescriptorsApi, 'updateDescriptor', 1>>().toEqualTypeOf<UpdateDescriptorBody>();
    expectTypeOf<Param<DescriptorsApi, 'record', 0>>().toEqualTypeOf<CreateObservationBody>();
  });

  it('should send readings, photo, match and review bodies typed by their schemas', () => {
    expectTypeOf<Param<ReadingsApi, 'create', 0>>().toEqualTypeOf<CreateReadingBody>();
    expectTypeOf<Param<ReadingsApi, 'supersede', 1>>().toEqualTypeOf<SupersedeReadingBody>();
    expectTypeOf<Param<ReadingsApi, 'list', 0>>().toEqualTypeOf<Partial<ListReadingsQuery>>();
    expectTypeOf<Param<PhotosApi, 'sample', 1>>().toEqualTypeOf<SampleBody>();
    expectTypeOf<Param<ReferenceSetApi, 'match', 0>>().toEqualTypeOf<MatchBody>();
    expectTypeOf<Param<ReviewsApi, 'review', 1>>().toEqualTypeOf<ReviewBody>();
  });

  it('should send calibration bodies typed by their schemas', () => {
    // A new session's thresholds and flags have defaults: the client sends the schema's input.
    expectTypeOf<Param<CalibrationApi, 'createSession', 0>>().toEqualTypeOf<z.input<typeof createSessionBody>>();
    expectTypeOf<Param<CalibrationApi, 'addSpecimen', 1>>().toEqualTypeOf<CreateSpecimenBody>();
    expectTypeOf<Param<CalibrationApi, 'respond', 1>>().toEqualTypeOf<CreateResponseBody>();
    expectTypeOf<Param<CalibrationApi, 'recordScreening', 0>>().toEqualTypeOf<CreateScreeningBody>();
  });
});
