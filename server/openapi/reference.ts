/**
 * The API reference page: Swagger UI (swagger-ui-dist, served from the installed package, so the
 * page needs no network) over /api/v1/openapi.json. Middleware rather than routes: it serves
 * files and one page, no API answers. Swagger UI's validator badge is off (it would call out).
 */
import path from 'node:path';
import { createRequire } from 'node:module';
import express, { Router } from 'express';
import { API_V1 } from './document';

const assets = path.dirname(createRequire(import.meta.url).resolve('swagger-ui-dist/package.json'));

const PAGE = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Edgeledger API v1 reference</title>
<link rel="stylesheet" href="swagger-ui.css">
</head>
<body>
<div id="swagger-ui"></div>
<script src="swagger-ui-bundle.js"></script>
<script src="reference.js"></script>
</body>
</html>
`;

// Scripts run from files only (the CSP allows no inline script).
const SCRIPT = `window.ui = SwaggerUIBundle({ url: ${JSON.stringify(`${API_V1}/openapi.json`)}, dom_id: '#swagger-ui', deepLinking: true, validatorUrl: null, withCredentials: true });\n`;

/** Mount at `${API_V1}/reference`: the page at its folder URL, then Swagger UI's files. */
export function apiReference(): Router {
  const router = Router();
  router.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const pathname = req.originalUrl.split('?')[0];
    if (req.path === '/' && !pathname.endsWith('/')) return res.redirect(301, `${pathname}/`);
    if (req.path === '/' || req.path === '/index.html') return res.type('html').set('Cache-Control', 'no-cache').send(PAGE);
    if (req.path === '/reference.js') return res.type('text/javascript').set('Cache-Control', 'no-cache').send(SCRIPT);
    next();
  });
  router.use(express.static(assets, { index: false, maxAge: '1d' }));
  return router;
}
