import helmet from 'helmet';
import type { RequestHandler } from 'express';
import type { Config } from '../config';

/**
 * A tight content security policy: everything the app needs ships with it from this origin.
 * HSTS and upgrade-insecure-requests only make sense behind TLS, so they follow `TLS`.
 */
export function securityHeaders(config: Config): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Angular Material sets inline style attributes at run time; styles never run code.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'"],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        ...(config.TLS ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: config.TLS ? { maxAge: 15_552_000, includeSubDomains: true } : false,
    crossOriginEmbedderPolicy: false,
  });
}
