// The built client files (dist/client: hashed bundles under /_astro/, and public/), served before the app.
import path from 'node:path';
import send from 'send';

const IMMUTABLE = 'public, max-age=31536000, immutable';

/**
 * Serves `req` from `root` when a file answers it; calls `fallThrough` otherwise (the app, its 404 included).
 * Only GET and HEAD of paths with a file extension outside /api/ are looked up on disk.
 */
export function createStaticFiles(root) {
  return (req, res, fallThrough) => {
    const pathname = (req.url ?? '/').split('?')[0];
    if ((req.method !== 'GET' && req.method !== 'HEAD') || pathname.startsWith('/api/') || path.posix.extname(pathname) === '') return fallThrough();
    const stream = send(req, pathname, { root, dotfiles: 'deny', index: false });
    stream.on('headers', (response) => {
      if (pathname.startsWith('/_astro/')) response.setHeader('cache-control', IMMUTABLE);
    });
    stream.on('error', () => fallThrough());
    stream.pipe(res);
  };
}
