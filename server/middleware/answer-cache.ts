import crypto from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { keptUntil } from '../queries/kept-until';
import type { Kept } from '../changes';
import { actorOf } from './auth';

/** A weak ETag of the answer, computed once, as Express's own (etag package) would for it. */
function etagOf(body: Buffer): string {
  const hash = crypto.createHash('sha1').update(body).digest('base64').substring(0, 27);
  return `W/"${body.length.toString(16)}-${hash}"`;
}

/** A kept answer: the JSON as sent, and the headers the route gave it. */
interface Answer {
  body: Buffer;
  headers: Record<string, string>;
}

/** The headers a route's answer carries itself (the app's own, helmet's say, are set again). */
const ANSWER_HEADERS = ['Content-Type', 'Cache-Control', 'Link'];

interface Group {
  answers: ReturnType<typeof keptUntil<string, Answer>>;
  /** What must still run before a kept answer is sent (the route's rate limit, say). */
  guard?: RequestHandler;
}

/** Runs `guard` (Express middleware, perhaps asynchronous), then `then` unless it answered or failed. */
function guarded(guard: RequestHandler, req: Request, res: Response, next: NextFunction, then: () => void): void {
  Promise.resolve(guard(req, res, (err?: unknown) => (err ? next(err) : then()))).catch(next);
}

/** Sends `answer`; with its ETag set, Express answers 304 when the client holds it already. */
function send(res: Response, answer: Answer): void {
  res.set(answer.headers).send(answer.body);
}

/**
 * The app's kept answers: what GET routes answered (status 200, JSON, with its ETag), by URL,
 * until a commit changes what the route's row of `KEPT` follows. Routes opt in with `keep`; the app serves
 * visitors from it early with `serveVisitors`, before sessions, body parsing and routing, which
 * were most of a kept read's time (measured with --cpu-prof: 2 400 kept reads a second through
 * the routers, against 5 300 served before them, on 2 cores). One per app.
 */
export class AnswerCache {
  private readonly groups: Group[] = [];
  /** Reads a kept answer could have served: served from it, and answered by the route. */
  private hits = 0;
  private misses = 0;
  private readonly enabled: boolean;

  /** `enabled: false` (ANSWER_CACHE=off) keeps nothing: every read runs its route. */
  constructor(options: { enabled?: boolean } = {}) {
    this.enabled = options.enabled ?? true;
  }

  /** Whether answers are kept, and how many reads were served from them (hits) or not (misses) since start. */
  stats(): { on: boolean; hits: number; misses: number } {
    return { on: this.enabled, hits: this.hits, misses: this.misses };
  }

  /**
   * Route middleware: keeps this route's answers until a commit changes what its row `kept` of
   * `KEPT` (server/changes/kept.ts) follows (mount it on read routes whose answer depends only on
   * that), and serves them. By default
   * only visitors are served (a signed-in person's page carries their own allowed actions);
   * `forEveryone` for routes whose answer is the same whoever asks (the comparison, search).
   * `guard` is middleware that runs first, for a kept answer too (a rate limit, say), on the
   * route and on the early path alike.
   */
  keep(kept: Kept, options: { forEveryone?: boolean; guard?: RequestHandler } = {}): RequestHandler {
    // At most 16 MB of answers per route group (a whole 5 000-cell comparison is about 2 MB).
    const answers = keptUntil<string, Answer>(kept, { max: 2_000, weigh: (a) => a.body.length, budget: 16 * 1024 * 1024, stage: 'answers' });
    const { guard } = options;
    this.groups.push({ answers, guard });
    const keepOrServe: RequestHandler = (req, res, next) => {
      if (req.method !== 'GET' || (!options.forEveryone && actorOf(req))) return next();
      const key = req.originalUrl;
      const hit = this.enabled ? answers.get(key) : undefined;
      if (hit !== undefined) {
        this.hits += 1;
        return send(res, hit);
      }
      this.misses += 1;
      if (!this.enabled) return next();
      const mark = answers.mark();
      const sendAnswer = res.send.bind(res);
      // res.json ends here too, with its text and a JSON content type.
      res.send = function keepAnswer(body?: unknown) {
        if (res.statusCode === 200 && (typeof body === 'string' || Buffer.isBuffer(body)) && /json/.test(String(res.get('Content-Type')))) {
          const bytes = Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8');
          const headers: Record<string, string> = { ETag: String(res.get('ETag') ?? etagOf(bytes)) };
          for (const name of ANSWER_HEADERS) if (res.get(name)) headers[name] = String(res.get(name));
          answers.keep(key, { body: bytes, headers }, mark);
          res.set('ETag', headers.ETag);
        }
        return sendAnswer(body);
      };
      next();
    };
    return guard ? (req, res, next) => guarded(guard, req, res, next, () => keepOrServe(req, res, next)) : keepOrServe;
  }

  /**
   * App middleware: a visitor's GET (`isVisitor` says who is one) with a kept answer is answered
   * here, after the group's guard; anything else passes on. Mount it after the middleware every
   * answer needs (security headers, the request log) and before the rest.
   */
  serveVisitors(isVisitor: (req: Request) => boolean): RequestHandler {
    return (req: Request, res: Response, next: NextFunction) => {
      if (!this.enabled || req.method !== 'GET' || !isVisitor(req)) return next();
      for (const { answers, guard } of this.groups) {
        const hit = answers.get(req.originalUrl);
        if (hit === undefined) continue;
        this.hits += 1;
        if (!guard) return send(res, hit);
        return guarded(guard, req, res, next, () => send(res, hit));
      }
      next();
    };
  }
}
