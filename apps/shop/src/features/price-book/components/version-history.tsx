import { formatDateTime } from '@benchwright/contracts';
import { MoreButton, Notice, Panel, TableHead } from '@benchwright/ui';
import { usePriceBookVersions } from '../api/versions';

/** The price book's changes, the latest first: which version, when, who, and what changed; more on demand. */
export function VersionHistory() {
  const q = usePriceBookVersions();
  return (
    <Panel title="Changes to the price book">
      {q.isError ? <Notice tone="error">{q.error.message}</Notice> : null}
      {q.isPending ? (
        <p>Loading the changes…</p>
      ) : q.data ? (
        <>
          <table className="w-full text-left">
            <TableHead columns={['Version', 'When', 'By', 'What changed']} />
            <tbody>
              {q.data.pages
                .flatMap((p) => p.versions)
                .map((v) => (
                  <tr key={v.version} className="border-b border-rule/50 align-top">
                    <td className="py-1 tabular-nums">{v.version}</td>
                    <td className="whitespace-nowrap pr-3">{formatDateTime(v.createdAt)}</td>
                    <td className="pr-3">{v.by?.name ?? 'Set up'}</td>
                    <td>{v.summary}</td>
                  </tr>
                ))}
            </tbody>
          </table>
          <MoreButton list={q} label="Show older changes" />
        </>
      ) : null}
    </Panel>
  );
}
