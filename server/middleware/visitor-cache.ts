import type { RequestHandler } from 'express';
import { onCellsChanged } from '../aggregates/comparison-cells';
import { onPagesChanged } from '../models/write-events';
import { keptUntil } from '../queries/kept-until';
import { actorOf } from './auth';

/**
 * What a visitor's GET of a page or a page list answered (status 200, as JSON text), by URL. A
 * visitor's page answer depends only on the pages (fields, bodies, links between them, pending
 * proposals) and on the approved results' figures, so it is kept until a page or a revision
 * changes or comparison cells do. Signed-in people get a fresh answer: theirs carries their own
 * allowed actions.
 */
const answers = keptUntil<string, string>([onPagesChanged, onCellsChanged], 2_000);

/** Serves visitors' repeated GETs from the cache above; mount on routes whose answer it describes. */
export const visitorCache: RequestHandler = (req, res, next) => {
  if (req.method !== 'GET' || actorOf(req)) return next();
  const key = req.originalUrl;
  const hit = answers.get(key);
  if (hit !== undefined) {
    res.type('json').send(hit);
    return;
  }
  const mark = answers.mark();
  res.json = function keepAnswer(body: unknown) {
    const text = JSON.stringify(body);
    if (res.statusCode === 200) answers.keep(key, text, mark);
    return res.type('json').send(text);
  };
  next();
};
