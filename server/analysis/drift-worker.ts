// A worker thread of the drift overview: analyses the pairs it is sent and posts their flags back.
import { parentPort } from 'node:worker_threads';
import { pairFlags, type PairInput } from './pair-flags.js';

parentPort?.on('message', (message: { id: number; pairs: PairInput[] }) => {
  parentPort!.postMessage({ id: message.id, results: message.pairs.map(pairFlags) });
});
