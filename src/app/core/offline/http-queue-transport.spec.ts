import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { IDEMPOTENCY_HEADER } from '../../../../shared/api/idempotency.js';
import { errorInterceptor } from '../http/error-interceptor';
import { HttpQueueTransport } from './http-queue-transport';
import { pendingReading, photoDto, readingDetail } from './testing/queue-fakes';

describe('HttpQueueTransport', () => {
  let transport: HttpQueueTransport;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    transport = TestBed.inject(HttpQueueTransport);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should post the reading with its Idempotency-Key', async () => {
    const { body } = pendingReading();
    const sent = transport.createReading(body as never, 'key-123');
    const req = http.expectOne('/api/readings');
    expect(req.request.method).toBe('POST');
    expect(req.request.headers.get(IDEMPOTENCY_HEADER)).toBe('key-123');
    expect(req.request.body).toEqual(body);
    req.flush(readingDetail(41));
    expect((await sent).id).toBe(41);
  });

  it('should upload the photo as multipart field "photo" with its Idempotency-Key', async () => {
    const sent = transport.uploadPhoto(new Blob(['jpeg']), 'leaf.jpg', 'key-456');
    const req = http.expectOne('/api/photos');
    expect(req.request.headers.get(IDEMPOTENCY_HEADER)).toBe('key-456');
    expect((req.request.body as FormData).get('photo')).toBeInstanceOf(Blob);
    req.flush(photoDto(12));
    expect((await sent).id).toBe(12);
  });

  it('should pass a refusal on as the server problem', async () => {
    const sent = transport.createReading(pendingReading().body as never, 'k');
    http.expectOne('/api/readings').flush({ type: 'x', title: 'Bad request', status: 400, detail: 'No accession 3.' }, { status: 400, statusText: 'Bad Request' });
    await expect(sent).rejects.toEqual(expect.objectContaining({ status: 400, detail: 'No accession 3.' }));
  });

  it('should ask /api/health whether the server can be reached', async () => {
    const reachable = transport.reachable();
    http.expectOne('/api/health').flush({ status: 'ok', version: '1' });
    expect(await reachable).toBe(true);
  });
});
