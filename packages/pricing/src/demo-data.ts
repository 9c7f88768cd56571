import { PriceBook, ShopSettings } from './price-book';
import { toMm } from './units';

/**
 * The demo shop's price book. INVENTED FOR THE DEMO: the prices and time
 * standards are made up and say nothing of any real supplier or shop.
 * Material properties (thickness, density, modulus) are typical published
 * figures; see each comment.
 */
export const demoPriceBook: PriceBook = PriceBook.parse({
  currency: 'USD',
  note: 'Invented demo prices and time standards, for the Fernhill Joinery demo only.',
  sheetGoods: [
    // modulus 1,800,000 psi: AWS 1st ed. (2009) 4.4.14.10 for veneer-core plywood with hardwood faces; density from memory
    { id: 'birch-ply-18', name: '3/4 in birch plywood', kind: 'plywood', nominalThicknessIn: 0.75, thicknessMm: 18.26, sheetLengthMm: 2438.4, sheetWidthMm: 1219.2, grain: 'lengthwise', densityKgM3: 680, modulusMPa: 12410, priceCents: 8900 },
    { id: 'birch-ply-12', name: '1/2 in birch plywood', kind: 'plywood', nominalThicknessIn: 0.5, thicknessMm: 11.9, sheetLengthMm: 2438.4, sheetWidthMm: 1219.2, grain: 'lengthwise', densityKgM3: 680, modulusMPa: 12410, priceCents: 6900 },
    { id: 'birch-ply-6', name: '1/4 in birch plywood', kind: 'plywood', nominalThicknessIn: 0.25, thicknessMm: 5.56, sheetLengthMm: 2438.4, sheetWidthMm: 1219.2, grain: 'lengthwise', densityKgM3: 680, modulusMPa: 12410, priceCents: 4200 },
    // MDF: modulus about 500,000 psi and density about 750 kg/m3, from memory
    { id: 'mdf-18', name: '3/4 in MDF', kind: 'mdf', nominalThicknessIn: 0.75, thicknessMm: 19.05, sheetLengthMm: 2438.4, sheetWidthMm: 1219.2, grain: 'none', densityKgM3: 750, modulusMPa: 3450, priceCents: 4800 },
    { id: 'mdf-12', name: '1/2 in MDF', kind: 'mdf', nominalThicknessIn: 0.5, thicknessMm: 12.7, sheetLengthMm: 2438.4, sheetWidthMm: 1219.2, grain: 'none', densityKgM3: 750, modulusMPa: 3450, priceCents: 3800 },
  ],
  lumber: [
    // densities and moduli from memory (USDA Wood Handbook order of magnitude)
    { id: 'walnut-4-4', name: 'Black walnut, 4/4', species: 'black walnut', roughThicknessIn: 1, densityKgM3: 610, modulusMPa: 11590, pricePerBoardFootCents: 1450 },
    { id: 'white-oak-4-4', name: 'White oak, 4/4', species: 'white oak', roughThicknessIn: 1, densityKgM3: 770, modulusMPa: 12270, pricePerBoardFootCents: 975 },
    { id: 'hard-maple-4-4', name: 'Hard maple, 4/4', species: 'hard maple', roughThicknessIn: 1, densityKgM3: 705, modulusMPa: 12620, pricePerBoardFootCents: 750 },
  ],
  edgeBanding: [
    { id: 'birch-banding-22', name: 'Birch veneer banding, 7/8 in', widthMm: 22.2, pricePerMetreCents: 35 },
    { id: 'walnut-banding-22', name: 'Walnut veneer banding, 7/8 in', widthMm: 22.2, pricePerMetreCents: 80 },
  ],
  hardware: [
    ...[10, 12, 14, 16, 18, 20, 22, 24, 26, 28].map((l) => ({ id: `slide-${l}`, name: `${l} in full-extension side-mount slides`, kind: 'slide' as const, unit: 'pair' as const, priceCents: 1200 + l * 60, lengthIn: l, massKg: 0.35 + l * 0.02 })),
    { id: 'hinge-concealed', name: 'Concealed hinge, full overlay, soft close', kind: 'hinge', unit: 'each', priceCents: 450, massKg: 0.09 },
    { id: 'shelf-pin', name: 'Shelf pin, 5 mm', kind: 'shelf_pin', unit: 'each', priceCents: 15, massKg: 0.002 },
    { id: 'pull-bar-128', name: 'Bar pull, 128 mm centres', kind: 'pull', unit: 'each', priceCents: 650, massKg: 0.08 },
    { id: 'caster-locking-5in', name: 'Locking swivel caster, 5 in', kind: 'caster', unit: 'each', priceCents: 1800, ratedLoadKg: 100, heightMm: toMm(5.75), massKg: 0.9 },
    { id: 'leveling-foot', name: 'Leveling foot, 2 in', kind: 'leveling_foot', unit: 'each', priceCents: 700, heightMm: toMm(2), massKg: 0.15 },
    { id: 'pocket-screw', name: 'Pocket screws, 1 1/4 in, box of 100', kind: 'pocket_screw', unit: 'box', perUnit: 100, priceCents: 800, massKg: 0.003 },
    { id: 'rail-screw', name: 'Cabinet screw, 2 1/2 in', kind: 'rail_screw', unit: 'each', priceCents: 25, massKg: 0.01 },
    { id: 'anti-tip-kit', name: 'Anti-tip wall anchor kit', kind: 'anti_tip_kit', unit: 'set', priceCents: 900, massKg: 0.1 },
  ],
  finishes: [
    { id: 'waterborne-poly', name: 'Waterborne polyurethane, satin', volumeSolids: 0.33, dryFilmMilsPerCoat: 1.2, transferEfficiency: 0.65, defaultCoats: 3, pricePerGallonCents: 6800 },
    { id: 'hardwax-oil', name: 'Hardwax oil', volumeSolids: 0.5, dryFilmMilsPerCoat: 0.6, transferEfficiency: 0.9, defaultCoats: 2, pricePerGallonCents: 11200 },
  ],
  labour: [
    { key: 'job_setup', name: 'Job set-up and material order', per: 'job', minutes: 45, stage: 'material' },
    { key: 'sheet_breakdown', name: 'Break down sheets', per: 'sheet', minutes: 12, stage: 'cutting' },
    { key: 'part_cut', name: 'Cut parts to size', per: 'part', minutes: 2, stage: 'cutting' },
    { key: 'edge_banding', name: 'Edge banding', per: 'metre', minutes: 1.5, stage: 'casework' },
    { key: 'pocket_hole', name: 'Pocket holes', per: 'hole', minutes: 0.5, stage: 'casework' },
    { key: 'case_assembly', name: 'Assemble cases', per: 'case', minutes: 60, stage: 'casework' },
    { key: 'drawer_box', name: 'Build drawer boxes', per: 'drawer', minutes: 35, stage: 'drawers_doors' },
    { key: 'slide_pair', name: 'Fit slides', per: 'pair', minutes: 15, stage: 'drawers_doors' },
    { key: 'door_hang', name: 'Hang doors', per: 'door', minutes: 20, stage: 'drawers_doors' },
    { key: 'torsion_top', name: 'Build torsion-box top', per: 'top', minutes: 180, stage: 'casework' },
    { key: 'trim_piece', name: 'Fit solid trim', per: 'piece', minutes: 12, stage: 'casework' },
    { key: 'finish_coat', name: 'Finish, per coat', per: 'm2_coat', minutes: 10, stage: 'finish' },
    { key: 'caster', name: 'Fit casters and feet', per: 'caster', minutes: 8, stage: 'casework' },
    { key: 'final_check', name: 'Final check and wrap', per: 'job', minutes: 30, stage: 'ready' },
  ],
  shopRateCents: 8500,
  labourCostPerHourCents: 3800,
  kerfMm: 3.2,
  sheetTrimMm: 6,
});

/** The demo shop's settings. INVENTED FOR THE DEMO. */
export const demoSettings: ShopSettings = ShopSettings.parse({
  revealMm: 3,
  overlayMm: 18,
  sheetCharging: 'whole',
  minSheetFraction: 0.25,
  materialMarkup: 0.35,
  consumablesRate: 0.05,
  taxRate: 0.0825,
  taxApplies: 'materials',
  depositRate: 0.5,
  estimateValidityDays: 30,
  budgetSpread: 0.15,
  shelfSagRatio: 600,
  // 40 lb/ft2: AWS 1st ed. (2009) 1.2.21, "other shelving"
  shelfLoadKPa: 1.915,
  // AWC NDS 3.5.2: long-term deflection 1.5 x initial for seasoned lumber
  shelfCreepFactor: 1.5,
  bandingWaste: 0.15,
  lumberWaste: 0.3,
  units: 'in',
});
