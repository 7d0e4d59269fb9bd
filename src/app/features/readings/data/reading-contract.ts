// The readings contract now lives in shared/api/reading-answers.ts; this re-export remains for
// code written against the client's earlier stand-in (core/offline). Import the shared file.
export * from '../../../../../shared/api/reading-answers.js';
