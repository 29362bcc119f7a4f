import crypto from 'node:crypto';

// Ids and single-use tokens (plumbing: imported by every module, imports none).

// Tokens travel in e-mailed links; only their SHA-256 is stored, so a copy of
// the database does not hand out working links.
export function newToken() {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string) {
  return crypto.createHash('sha256').update(token).digest('hex');
}

export function newId() {
  return crypto.randomUUID();
}

export function isoIn(ms: number) {
  return new Date(Date.now() + ms).toISOString();
}
