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

/**
 * API answers hold calc records and people's names, so no browser cache, proxy or shared computer keeps them
 * (`private, no-store`, as the report, attachment and evidence downloads already say). With nothing kept there is
 * nothing to revalidate, so the app computes no ETag either (createApp): Express's default hashes every answer's
 * body for one. Files of the client build keep their own caching (serveClient) and are asked about by date
 * (Last-Modified) instead.
 */
export const apiNoStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'private, no-store');
  next();
};
