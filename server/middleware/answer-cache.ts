import crypto from 'node:crypto';
import type { RequestHandler } from 'express';
import { keptUntil, type ChangeEvent } from '../queries/kept-until';
import { actorOf } from './auth';

/** A weak ETag of the answer, computed once, as Express's own (etag package) would for it. */
function etagOf(text: string): string {
  const hash = crypto.createHash('sha1').update(text, 'utf8').digest('base64').substring(0, 27);
  return `W/"${Buffer.byteLength(text, 'utf8').toString(16)}-${hash}"`;
}

/**
 * Keeps what a GET answered (status 200, as JSON text with its ETag), by URL, until one of
 * `events` fires, and serves the same URL from it. Mount it on read routes whose answer depends
 * only on what those events follow. By default only visitors are served from it (a signed-in
 * person's page carries their own allowed actions); `forEveryone` for routes whose answer is the
 * same whoever asks (the comparison, search).
 */
export function answerCache(events: ChangeEvent[], options: { forEveryone?: boolean } = {}): RequestHandler {
  // At most 16 MB of answers per route group (a whole 5 000-cell comparison is about 2 MB).
  const answers = keptUntil<string, { text: string; etag: string }>(events, { max: 2_000, weigh: (a) => a.text.length, budget: 16 * 1024 * 1024 });
  return (req, res, next) => {
    if (req.method !== 'GET' || (!options.forEveryone && actorOf(req))) return next();
    const key = req.originalUrl;
    const hit = answers.get(key);
    if (hit !== undefined) {
      // With the ETag set, Express neither hashes the answer again nor skips a 304.
      res.set('ETag', hit.etag).type('json').send(hit.text);
      return;
    }
    const mark = answers.mark();
    const send = res.send.bind(res);
    // res.json ends here too, with its text and a JSON content type.
    res.send = function keepAnswer(body?: unknown) {
      if (res.statusCode === 200 && typeof body === 'string' && /json/.test(String(res.get('Content-Type')))) {
        const etag = String(res.get('ETag') ?? etagOf(body));
        answers.keep(key, { text: body, etag }, mark);
        res.set('ETag', etag);
      }
      return send(body);
    };
    next();
  };
}
