import { Observable, Subject, of, throwError } from 'rxjs';

import { Poller } from './poller';

interface Answer {
  status: 'open' | 'closed';
  n: number;
}

describe('Poller', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  function counting(answers: Answer[]): { load: () => Observable<Answer>; calls: () => number } {
    let calls = 0;
    return { load: () => of(answers[Math.min(calls++, answers.length - 1)]), calls: () => calls };
  }

  it('should ask at once and then every period while the session is open', () => {
    const source = counting([{ status: 'open', n: 1 }, { status: 'open', n: 2 }, { status: 'open', n: 3 }]);
    const poller = new Poller(source.load, (a) => a.status === 'open', 1000);
    poller.start();
    expect(source.calls()).toBe(1);
    vi.advanceTimersByTime(2000);
    expect(source.calls()).toBe(3);
    expect(poller.value()?.n).toBe(3);
    expect(poller.running()).toBe(true);
    poller.stop();
  });

  it('should stop by itself once an answer says the session is closed, keeping that answer', () => {
    const source = counting([{ status: 'open', n: 1 }, { status: 'closed', n: 2 }]);
    const poller = new Poller(source.load, (a) => a.status === 'open', 1000);
    poller.start();
    vi.advanceTimersByTime(1000);
    expect(poller.value()).toEqual({ status: 'closed', n: 2 });
    expect(poller.running()).toBe(false);
    vi.advanceTimersByTime(10_000);
    expect(source.calls()).toBe(2);
  });

  it('should stop asking when stopped (the page is left)', () => {
    const source = counting([{ status: 'open', n: 1 }]);
    const poller = new Poller(source.load, () => true, 1000);
    poller.start();
    poller.stop();
    vi.advanceTimersByTime(5000);
    expect(source.calls()).toBe(1);
    expect(poller.running()).toBe(false);
  });

  it('should keep the error of a failed request and try again on the next tick', () => {
    let calls = 0;
    const load = () => (calls++ === 0 ? throwError(() => new Error('offline')) : of<Answer>({ status: 'open', n: 7 }));
    const poller = new Poller(load, () => true, 1000);
    poller.start();
    expect(poller.error()).toBeInstanceOf(Error);
    vi.advanceTimersByTime(1000);
    expect(poller.error()).toBeNull();
    expect(poller.value()?.n).toBe(7);
    poller.stop();
  });

  it('should drop a slow answer when the next tick asks again', () => {
    const pending: Subject<Answer>[] = [];
    const poller = new Poller(() => {
      const s = new Subject<Answer>();
      pending.push(s);
      return s;
    }, () => true, 1000);
    poller.start();
    vi.advanceTimersByTime(1000);
    pending[0].next({ status: 'open', n: 1 });
    expect(poller.value()).toBeNull();
    pending[1].next({ status: 'open', n: 2 });
    expect(poller.value()?.n).toBe(2);
    poller.stop();
  });
});
