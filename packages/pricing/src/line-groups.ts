/** The groups of an estimate's lines, in the order they are shown. */
export const LINE_GROUPS = [
  'sheet_goods',
  'solid_wood',
  'edge_banding',
  'hardware',
  'finish',
  'consumables',
  'labour',
  'delivery',
  'other',
] as const;
export type LineGroup = (typeof LINE_GROUPS)[number];

/** How the groups are headed on screens and in the PDF. */
export const LINE_GROUP_LABELS: Record<LineGroup, string> = {
  sheet_goods: 'Sheet goods',
  solid_wood: 'Solid wood',
  edge_banding: 'Edge banding',
  hardware: 'Hardware',
  finish: 'Finish',
  consumables: 'Shop supplies',
  labour: 'Shop time',
  delivery: 'Delivery',
  other: 'Other',
};
