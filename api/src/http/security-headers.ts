import helmet from 'helmet';

/**
 * helmet with a content security policy the Angular app runs under: scripts, styles, fonts and connections
 * from our own origin only. Inline styles stay allowed because Angular and Material set component styles at
 * run time. HSTS and upgrade-insecure-requests only when served over HTTPS.
 */
export function securityHeaders(https: boolean) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        baseUri: ["'self'"],
        scriptSrc: ["'self'"],
        scriptSrcAttr: ["'none'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        imgSrc: ["'self'", 'data:', 'blob:'],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        upgradeInsecureRequests: https ? [] : null,
      },
    },
    strictTransportSecurity: https ? { maxAge: 15552000, includeSubDomains: true } : false,
  });
}
