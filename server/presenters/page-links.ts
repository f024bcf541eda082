import type { Request, Response } from 'express';

/** Where a paged list stands: the page asked for (from 1), its size and the whole list's length. */
export interface PageInfo {
  page: number;
  pageSize: number;
  total: number;
}

/**
 * The RFC 8288 `Link` header of one page of a list: first, prev, next and last, each the
 * request's own path and query with `page` set (a path-absolute URI reference, resolved against
 * the request's URI as RFC 8288 §3.1 allows). prev is left out on the first page, next on the last;
 * an empty list has one page.
 */
export function pageLinkHeader(requestUrl: string, { page, pageSize, total }: PageInfo): string {
  const url = new URL(requestUrl, 'http://origin.invalid');
  const last = Math.max(1, Math.ceil(total / pageSize));
  const link = (p: number, rel: string) => {
    url.searchParams.set('page', String(p));
    return `<${url.pathname}${url.search}>; rel="${rel}"`;
  };
  const links = [link(1, 'first')];
  if (page > 1) links.push(link(Math.min(page - 1, last), 'prev'));
  if (page < last) links.push(link(page + 1, 'next'));
  links.push(link(last, 'last'));
  return links.join(', ');
}

/** Sets the `Link` header of a paged list's answer (every paged list of the API carries one). */
export function setPageLinks(req: Request, res: Response, page: PageInfo): Response {
  return res.set('Link', pageLinkHeader(req.originalUrl, page));
}
