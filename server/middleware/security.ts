import helmet from 'helmet';
import type { Config } from '../config';

/**
 * Security headers. The CSP allows only our own origin; images may be data: or blob: URLs (drawdown
 * exports), and inline styles are allowed because Konva and React set style attributes.
 */
export function securityHeaders(config: Config) {
  const https = config.publicUrl.startsWith('https:');
  return helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        // Upgrading requests would break a plain-http install on a local network.
        upgradeInsecureRequests: https ? [] : null,
      },
    },
    strictTransportSecurity: https,
  });
}
