import type { RequestHandler } from 'express';
import helmet from 'helmet';

// CSP that lets the app, MapLibre's workers (blob:) and its WebGL canvas run,
// and nothing load from outside this server.
export function securityHeaders(secure: boolean): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        childSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        ...(secure ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: secure,
    crossOriginEmbedderPolicy: false,
  });
}

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const LOOPBACK_NAMES = new Set(['localhost', '127.0.0.1', '[::1]']);

/**
 * The origins allowed to send state-changing requests: APP_URL's and the configured
 * ALLOWED_ORIGINS. Never "whatever Host the request names": under DNS rebinding an
 * attacker's name resolves to this server and the browser sends Host and Origin alike.
 * A loopback APP_URL (http://localhost:3000) also accepts 127.0.0.1 and [::1] on the
 * same port — IP literals cannot be rebound.
 */
export function allowedOrigins(appUrl: string, extra: string[]): Set<string> {
  const app = new URL(appUrl);
  const out = new Set([app.origin, ...extra]);
  if (LOOPBACK_NAMES.has(app.hostname))
    for (const h of LOOPBACK_NAMES) out.add(`${app.protocol}//${h}${app.port ? `:${app.port}` : ''}`);
  return out;
}

// CSRF defence for cookie sessions: a state-changing request must say where it
// comes from (Origin, or Referer when a client sends no Origin), and that must be
// one of the allowed origins.
export function originCheck(appUrl: () => string, extra: () => string[] = () => []): RequestHandler {
  let cached: { key: string; set: Set<string> } | null = null;
  return (req, res, next) => {
    if (!UNSAFE.has(req.method)) return next();
    const key = `${appUrl()}|${extra().join(',')}`;
    if (cached?.key !== key) cached = { key, set: allowedOrigins(appUrl(), extra()) };
    const source = req.get('origin') ?? req.get('referer');
    let origin: string | null = null;
    try {
      origin = source && source !== 'null' ? new URL(source).origin : null;
    } catch {
      origin = null;
    }
    if (origin && cached.set.has(origin)) return next();
    res.status(403).json({
      error: {
        code: 'bad_origin',
        message:
          'Cross-site or origin-less request refused; send an Origin header of this server (its public address, APP_URL)',
      },
    });
  };
}
