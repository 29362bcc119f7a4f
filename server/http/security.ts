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

// CSRF defence for cookie sessions: a state-changing request must say where it
// comes from, and that must be this server (or the configured public URL).
export function originCheck(appUrl: () => string): RequestHandler {
  return (req, res, next) => {
    if (!UNSAFE.has(req.method)) return next();
    const allowed = new URL(appUrl()).host;
    const source = req.get('origin') ?? req.get('referer');
    let host: string | null = null;
    try {
      host = source && source !== 'null' ? new URL(source).host : null;
    } catch {
      host = null;
    }
    if (host && (host === allowed || host === req.get('host'))) return next();
    res.status(403).json({
      error: {
        code: 'bad_origin',
        message: 'Cross-site or origin-less request refused; send an Origin header for this server',
      },
    });
  };
}
