// One normalisation for e-mail addresses wherever one is used as a key: the
// account look-up (EmailSchema trims and lower-cases) and the rate limits.
export const normalizeEmail = (v: unknown) =>
  String(v ?? '')
    .trim()
    .toLowerCase();
