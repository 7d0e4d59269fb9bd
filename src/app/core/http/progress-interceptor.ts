import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { finalize } from 'rxjs';

import { RequestProgress } from './request-progress';

/** Counts each request in {@link RequestProgress} from send to completion, error or cancel. */
export const progressInterceptor: HttpInterceptorFn = (req, next) => {
  const progress = inject(RequestProgress);
  progress.start();
  return next(req).pipe(finalize(() => progress.end()));
};
