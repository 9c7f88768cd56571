import { createContext, useContext, type ReactNode } from 'react';
import type { ApiIssue } from '@benchwright/contracts';

/** An issue's path within the piece: `items[0].spec.cases[1].widthMm` -> `cases[1].widthMm`. */
export const specPath = (path: string) => path.replace(/^items\[\d+\]\.spec\.?/, '');

/** The issues of the piece by their path within it. */
export type IssueMap = ReadonlyMap<string, string[]>;
export function issueMap(issues: readonly ApiIssue[]): IssueMap {
  const m = new Map<string, string[]>();
  for (const i of issues) {
    const p = specPath(i.path);
    m.set(p, [...(m.get(p) ?? []), i.message]);
  }
  return m;
}

const IssuesContext = createContext<IssueMap>(new Map());
export const IssuesProvider = ({ issues, children }: { issues: IssueMap; children: ReactNode }) => (
  <IssuesContext.Provider value={issues}>{children}</IssuesContext.Provider>
);
/** A lookup of the messages for any of some paths (one context read, so it may be called anywhere in render). */
export function useIssueLookup(): (...paths: string[]) => string[] {
  const m = useContext(IssuesContext);
  return (...paths) => paths.flatMap((p) => m.get(p) ?? []);
}

/** A field's words on the screen, where its name in the piece differs. */
const FIELD_WORDS: Record<string, string> = {
  widthMm: 'width',
  heightMm: 'height',
  depthMm: 'depth',
  xMm: 'place along the bench',
  hingeSide: 'hinged on',
  workingLoadKg: 'working load',
  casterId: 'casters',
  footId: 'feet',
  joinery: 'case joints',
  drawerFronts: 'drawer fronts',
  gridSpacingMm: 'grid spacing',
  thicknessMm: 'thickness',
  compartments: 'sections',
};

/** "cases[0].bays[1].compartments[2].heightMm" -> "Case 1, Bay 2, Section 3, height" (the words on the screen) */
export function plainPath(path: string): string {
  return specPath(path)
    .replace(/cases\[(\d+)\]/g, (_m, i) => `Case ${Number(i) + 1}`)
    .replace(/bays\[(\d+)\]/g, (_m, i) => `Bay ${Number(i) + 1}`)
    .replace(/compartments\[(\d+)\]/g, (_m, i) => `Section ${Number(i) + 1}`)
    .replace(/\b[a-z]\w*$/, (f) => FIELD_WORDS[f] ?? f)
    .replace(/\./g, ', ')
    .replace(/^, /, '');
}

/** The messages of a field, beside it, in the client's words (the engine's sentences say what to change). */
export function FieldIssues({ id, messages }: { id?: string; messages: readonly string[] }) {
  if (!messages.length) return null;
  return (
    <ul id={id} className="mt-1 text-sm text-alert">
      {messages.map((m) => (
        <li key={m}>{m}</li>
      ))}
    </ul>
  );
}
