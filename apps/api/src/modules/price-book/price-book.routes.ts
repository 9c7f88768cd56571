import express, { Router } from 'express';
import {
  PRICE_IMPORT_MAX_BYTES,
  PriceBookKind,
  PriceBookVersionsQuery,
  PriceImportQuery,
  PriceItemBody,
  PriceItemPatch,
  type User,
} from '@benchwright/contracts';
import { NotFound, parse, UnsupportedMediaType } from '../../lib/errors';
import type { PriceBookService } from './price-book.service';

function kindOf(raw: unknown) {
  const k = PriceBookKind.safeParse(raw);
  if (!k.success) throw new NotFound('That price-book kind');
  return k.data;
}

/**
 * A CSV body as text: text/csv (UTF-8 if a charset is named), no NUL byte, valid UTF-8; 415 otherwise. The byte
 * limit is the raw parser's (413 above).
 */
function csvText(req: express.Request): string {
  if (!req.is('text/csv')) throw new UnsupportedMediaType('Send the file as text/csv.');
  const charset = /charset=([^;]+)/i
    .exec(req.get('content-type') ?? '')?.[1]
    ?.trim()
    .toLowerCase();
  if (charset && charset !== 'utf-8' && charset !== 'utf8') throw new UnsupportedMediaType('Send the CSV as UTF-8.');
  const buf: unknown = req.body;
  if (!Buffer.isBuffer(buf)) return '';
  if (buf.includes(0)) throw new UnsupportedMediaType('That is not a text file.');
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buf);
  } catch {
    throw new UnsupportedMediaType('That file is not UTF-8 text; save it as CSV UTF-8.');
  }
}

/** The owner's price book (mounted with requireRole('owner')). */
export function priceBookRoutes(service: PriceBookService): Router {
  const r = Router();
  const user = (res: express.Response) => res.locals.user as User;
  r.get('/', (_req, res) => {
    res.json({ priceBook: service.view() });
  });
  r.get('/versions', (req, res) => {
    res.json(service.versions(parse(PriceBookVersionsQuery, req.query)));
  });
  r.get('/:kind.csv', (req, res) => {
    const kind = kindOf(req.params.kind);
    res.type('text/csv; charset=utf-8').attachment(`${kind}.csv`).send(service.csv(kind));
  });
  r.post('/:kind/import', express.raw({ type: () => true, limit: PRICE_IMPORT_MAX_BYTES }), (req, res) => {
    const kind = kindOf(req.params.kind);
    const q = parse(PriceImportQuery, req.query);
    const text = csvText(req);
    const dryRun = q.dryRun === '1' || q.dryRun === 'true';
    res.json(service.import(user(res), kind, text, dryRun));
  });
  r.post('/:kind', (req, res) => {
    const kind = kindOf(req.params.kind);
    const body = parse(PriceItemBody, req.body);
    res.status(201).json(service.add(user(res), kind, body.item));
  });
  r.patch('/:kind/:id', (req, res) => {
    const kind = kindOf(req.params.kind);
    const body = parse(PriceItemPatch, req.body);
    res.json(service.edit(user(res), kind, req.params.id, body));
  });
  return r;
}
