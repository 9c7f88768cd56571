import { PRICE_BOOK_KINDS, PRICE_KINDS } from '@benchwright/contracts';
import { Notice, Panel } from '@benchwright/ui';
import { usePriceBook } from '../api/price-book';
import { CsvImport } from './csv-import';
import { PriceTable } from './price-table';
import { VersionHistory } from './version-history';
import type { CellUnits } from './cells';

/**
 * The owner's price book: a section per kind, each with its table and its CSV. The tables read in the shop's units
 * (`cu`, from the settings); the CSV keeps the stored units its columns name.
 */
export function PriceBookPage({ cu }: { cu: CellUnits }) {
  const q = usePriceBook();
  if (q.isPending) return <p>Loading the price book…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const book = q.data;
  return (
    <>
      <Panel title="Price book" level={1}>
        <p className="text-ink-soft">
          Version {book.version}. Every change makes a new version; an estimate keeps the version it was priced with,
          and a new revision prices from today’s book.
        </p>
      </Panel>
      {PRICE_BOOK_KINDS.map((kind) => {
        const info = PRICE_KINDS[kind];
        return (
          <Panel key={kind} title={info.label}>
            <PriceTable kind={kind} entries={book[info.key]} cu={cu} />
            <CsvImport kind={kind} label={info.label} cu={cu} />
          </Panel>
        );
      })}
      <VersionHistory />
    </>
  );
}
