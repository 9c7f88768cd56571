/**
 * What the PDF worker thread runs (lib/pdf-pool.ts bundles this file for it):
 * one document from plain data, returned as bytes. The caller reads the
 * database and passes everything in, so the worker never opens it.
 */
import { threadId } from 'node:worker_threads';
import { renderEstimatePdf, type EstimatePdfInput } from './estimate-pdf';
import { renderLabelsPdf, type LabelsPdfInput } from './labels-pdf';
import { renderTravellerPdf, type TravellerPdfInput } from './traveller-pdf';

export type PdfTask =
  | { kind: 'estimate'; input: EstimatePdfInput }
  | { kind: 'traveller'; input: TravellerPdfInput }
  | { kind: 'labels'; input: LabelsPdfInput }
  | { kind: 'ping' };

/** A Buffer sent to the worker arrives as a plain Uint8Array; react-pdf reads image data from a Buffer. */
const asBuffer = (b: Uint8Array | null | undefined) => (b ? Buffer.from(b.buffer, b.byteOffset, b.byteLength) : b);

export async function renderPdf(task: PdfTask): Promise<Uint8Array> {
  switch (task.kind) {
    case 'estimate':
      return renderEstimatePdf({ ...task.input, shop: { ...task.input.shop, logo: asBuffer(task.input.shop.logo) } });
    case 'traveller':
      return renderTravellerPdf({ ...task.input, logo: asBuffer(task.input.logo) });
    case 'labels':
      return renderLabelsPdf(task.input);
    case 'ping':
      // the thread that answers: never the request thread (0)
      return new Uint8Array([threadId]);
  }
}

export default function run(task: PdfTask): Promise<Uint8Array> {
  return renderPdf(task);
}
