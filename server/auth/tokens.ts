// Moved to server/ids.ts (plumbing); kept for modules not yet moved over.
export * from '../ids';
