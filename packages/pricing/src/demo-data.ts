import { PriceBook, ShopSettings } from './price-book';
import { toMm } from './units';

/**
 * The demo shop's price book. INVENTED FOR THE DEMO: the prices and time
 * standards are made up and say nothing of any real supplier or shop.
 * Material properties (thickness, density, modulus): each comment names the
 * source actually read, the edition and table, and says that it was read in a
 * secondary copy at a stored address (these machines reach no website); a
 * value with no copy of a published table found says "from memory". Density
 * of solid wood at 12 % moisture = specific gravity (oven-dry weight, volume at
 * 12 %) x 1000 kg/m3 x 1.12 (the moisture's weight).
 */
export const demoPriceBook: PriceBook = PriceBook.parse({
  currency: 'USD',
  note: 'Invented demo prices and time standards, for the Fernhill Joinery demo only.',
  sheetGoods: [
    // Birch plywood (all three thicknesses): modulus 1,800,000 psi (12,410 MPa), the value the Architectural
    // Woodwork Standards, 1st ed. (2009), 4.4.14.10 shelf-span table uses for veneer-core plywood with hardwood
    // veneer both faces (test/fixtures/shelf-spans.md, a copy of that table). Density by thickness from a maker's
    // "Birch Plywood Datasheet" (all-birch plywood of 1.4 mm veneers, sanded; average kg/m3 per thickness: 685 at
    // 18 mm, 695 at 12 mm, 670 at 6.5 mm), read in a secondary copy at
    // https://vdocuments.site/birch-plywood-datasheet-l-birch-plywood-datasheetl-average-lower-limit-upper.html.
    // A birch-faced panel over a lighter core weighs less, so the weight errs heavy, the safe side for the caster
    // and tip-over checks. (The Wood Handbook's clear yellow birch, specific gravity 0.62 at 12 %, gives 694 kg/m3.)
    {
      id: 'birch-ply-18',
      name: '3/4 in birch plywood',
      kind: 'plywood',
      nominalThicknessIn: 0.75,
      thicknessMm: 18.26,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'lengthwise',
      densityKgM3: 685,
      modulusMPa: 12410,
      priceCents: 8900,
    },
    {
      id: 'birch-ply-12',
      name: '1/2 in birch plywood',
      kind: 'plywood',
      nominalThicknessIn: 0.5,
      thicknessMm: 11.9,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'lengthwise',
      densityKgM3: 695,
      modulusMPa: 12410,
      priceCents: 6900,
    },
    {
      id: 'birch-ply-6',
      name: '1/4 in birch plywood',
      kind: 'plywood',
      nominalThicknessIn: 0.25,
      thicknessMm: 5.56,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'lengthwise',
      densityKgM3: 670,
      modulusMPa: 12410,
      priceCents: 4200,
    },
    // MDF: modulus 2,800 MPa, the minimum average modulus of elasticity for MDF up to 20 mm thick in Indian
    // Standard IS 12406:2003 (Medium density fibre boards for general purposes), table of physical and mechanical
    // properties, read in a secondary copy (a maker's page quoting the table) at
    // http://www.mangalamtimber.com/index.php/technical-specifications/interior-grade. A standard's minimum, so the
    // sag check errs on the safe side. The Wood Handbook (FPL-GTR-190, 2010) ch. 12, "Medium-Density Fiberboard",
    // points to ANSI A208.2-2002 for MDF minimums and lists makers' values in its Table 12-6 (the text was read in
    // a secondary copy at https://issuhub.com/view/index?id=5801&pageIndex=284; the table and the ANSI grade table
    // were not found). Density 750 kg/m3: makeitfrom.com's MDF page (0.75 g/cm3), a secondary copy citing the Wood
    // Handbook (1999 edition), at https://www.makeitfrom.com/material-properties/Medium-Density-Fiberboard-MDF.
    {
      id: 'mdf-18',
      name: '3/4 in MDF',
      kind: 'mdf',
      nominalThicknessIn: 0.75,
      thicknessMm: 19.05,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'none',
      densityKgM3: 750,
      modulusMPa: 2800,
      priceCents: 4800,
    },
    {
      id: 'mdf-12',
      name: '1/2 in MDF',
      kind: 'mdf',
      nominalThicknessIn: 0.5,
      thicknessMm: 12.7,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'none',
      densityKgM3: 750,
      modulusMPa: 2800,
      priceCents: 3800,
    },
    // Tempered hardboard, for backs and drawer bottoms that need no grain. Density 1000 kg/m3: R. M. Granum and
    // O. B. Eustis, "Hardboard (Masonite): What is it?" (Panel Processing, 1999): "placed in water many hardboard
    // products will sink or barely float", that is about 1000 kg/m3; read in a secondary copy at
    // https://tr.scribd.com/document/217232302/Hardboard. The encyclopedia article "Hardboard" (citing Frane, 1994,
    // p. 156) gives usually 50-65 lb/ft3 (800-1040 kg/m3), tempered board at the dense end (copy at
    // https://en-academic.com/dic.nsf/enwiki/756984); ANSI A135.4 (as the Architectural Woodwork Standards, 1st ed.
    // 2009, 4.2h quote it) asks at least 31 lb/ft3. Modulus 2,800 MPa: no published hardboard stiffness was found
    // (ANSI A135.4 sets strength minimums, not stiffness), so it takes the MDF minimum of IS 12406:2003 (see the MDF
    // entry below), a lower bound for a denser fibreboard and so the safe side. It enters no check today: the
    // modulus is read only by the shelf-sag check, and hardboard is refused for a carcass, so never makes a shelf
    // (validate.ts).
    {
      id: 'hardboard-6',
      name: '1/4 in tempered hardboard',
      kind: 'hardboard',
      nominalThicknessIn: 0.25,
      thicknessMm: 6.35,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'none',
      densityKgM3: 1000,
      modulusMPa: 2800,
      priceCents: 2400,
    },
  ],
  lumber: [
    // Clear wood at 12 % moisture (density from specific gravity as said above).
    {
      id: 'walnut-4-4',
      name: 'Black walnut, 4/4',
      species: 'black walnut',
      roughThicknessIn: 1,
      // Specific gravity 0.55 and modulus 11.6 GPa ("Dry" row): the USDA Forest Products Laboratory's species sheet
      // "Juglans nigra, Black Walnut" (mechanical properties, 2-inch standard), the sheet of Alden, Hardwoods of
      // North America, FPL-GTR-83 (1995), read in a secondary copy at
      // https://docslib.org/doc/7040862/juglansnigra-family-juglandaceae-black-walnut; 0.55 x 1.12 x 1000 = 616 kg/m3
      densityKgM3: 616,
      modulusMPa: 11600,
      pricePerBoardFootCents: 1450,
    },
    {
      id: 'white-oak-4-4',
      name: 'White oak, 4/4',
      species: 'white oak',
      roughThicknessIn: 1,
      // Specific gravity 0.68 at 12 %: G. Wengert's FDMC column quoting the Wood Handbook (Agriculture Handbook 72),
      // a secondary copy; 0.68 x 1.12 x 1000 = 762 kg/m3. Modulus 12,270 MPa (1.78 million psi): Tioga Hardwoods'
      // white oak page (http://www.tiogahardwoods.com/species.aspx?zone=Species&pID=987: 12,273 MPa, specific gravity
      // 0.68), a secondary copy that names no source; the Wood Handbook's Table 5-3 row for white oak itself was not
      // found in a stored copy.
      densityKgM3: 762,
      modulusMPa: 12270,
      pricePerBoardFootCents: 975,
    },
    {
      id: 'hard-maple-4-4',
      name: 'Hard maple, 4/4',
      species: 'hard maple',
      roughThicknessIn: 1,
      // Specific gravity 0.63 and modulus 12,600 MPa at 12 % (sugar maple): the Wood Handbook's clear-wood strength
      // table (Table 5-3a, metric, of FPL-GTR-190, 2010) as tabulated by engdatabase.com's "Maple, Sugar" page, a
      // secondary copy at https://engdatabase.com/data/wood-properties/maple-sugar; 0.63 x 1.12 x 1000 = 706 kg/m3
      densityKgM3: 706,
      modulusMPa: 12600,
      pricePerBoardFootCents: 750,
    },
  ],
  edgeBanding: [
    { id: 'birch-banding-22', name: 'Birch veneer banding, 7/8 in', widthMm: 22.2, pricePerMetreCents: 35 },
    { id: 'walnut-banding-22', name: 'Walnut veneer banding, 7/8 in', widthMm: 22.2, pricePerMetreCents: 80 },
  ],
  hardware: [
    ...[10, 12, 14, 16, 18, 20, 22, 24, 26, 28].map((l) => ({
      id: `slide-${l}`,
      name: `${l} in full-extension side-mount slides`,
      kind: 'slide' as const,
      unit: 'pair' as const,
      priceCents: 1200 + l * 60,
      lengthIn: l,
      massKg: 0.35 + l * 0.02,
    })),
    {
      id: 'hinge-concealed',
      name: 'Concealed hinge, full overlay, soft close',
      kind: 'hinge',
      overlay: 'full',
      unit: 'each',
      priceCents: 450,
      massKg: 0.09,
    },
    {
      id: 'hinge-half-overlay',
      name: 'Concealed hinge, half overlay, soft close',
      kind: 'hinge',
      overlay: 'half',
      unit: 'each',
      priceCents: 450,
      massKg: 0.09,
    },
    {
      id: 'hinge-inset',
      name: 'Concealed hinge, inset, soft close',
      kind: 'hinge',
      overlay: 'inset',
      unit: 'each',
      priceCents: 480,
      massKg: 0.09,
    },
    { id: 'shelf-pin', name: 'Shelf pin, 5 mm', kind: 'shelf_pin', unit: 'each', priceCents: 15, massKg: 0.002 },
    { id: 'pull-bar-128', name: 'Bar pull, 128 mm centers', kind: 'pull', unit: 'each', priceCents: 650, massKg: 0.08 },
    {
      id: 'caster-locking-5in',
      name: 'Locking swivel caster, 5 in',
      kind: 'caster',
      unit: 'each',
      priceCents: 1800,
      ratedLoadKg: 100,
      heightMm: toMm(5.75),
      massKg: 0.9,
    },
    {
      id: 'leveling-foot',
      name: 'Leveling foot, 2 in',
      kind: 'leveling_foot',
      unit: 'each',
      priceCents: 700,
      heightMm: toMm(2),
      massKg: 0.15,
    },
    {
      id: 'pocket-screw',
      name: 'Pocket screws, 1 1/4 in, box of 100',
      kind: 'pocket_screw',
      unit: 'box',
      perUnit: 100,
      lengthIn: 1.25,
      priceCents: 800,
      massKg: 0.003,
    },
    {
      id: 'pocket-screw-1in',
      name: 'Pocket screws, 1 in, box of 100',
      kind: 'pocket_screw',
      unit: 'box',
      perUnit: 100,
      lengthIn: 1,
      priceCents: 750,
      massKg: 0.002,
    },
    {
      id: 'pocket-screw-1-5in',
      name: 'Pocket screws, 1 1/2 in, box of 100',
      kind: 'pocket_screw',
      unit: 'box',
      perUnit: 100,
      lengthIn: 1.5,
      priceCents: 850,
      massKg: 0.004,
    },
    {
      id: 'screw-slide',
      name: 'Pan-head screws #6 x 5/8 in, for slides, box of 100',
      kind: 'screw',
      fastens: 'slide',
      lengthIn: 0.625,
      unit: 'box',
      perUnit: 100,
      priceCents: 600,
      massKg: 0.001,
    },
    {
      id: 'screw-hinge',
      name: 'Flat-head screws #6 x 5/8 in, for hinges and plates, box of 100',
      kind: 'screw',
      fastens: 'hinge',
      lengthIn: 0.625,
      unit: 'box',
      perUnit: 100,
      priceCents: 600,
      massKg: 0.001,
    },
    {
      id: 'screw-drawer-front',
      name: 'Pan-head screws #8 x 1 in, for drawer fronts, box of 100',
      kind: 'screw',
      fastens: 'drawer_front',
      lengthIn: 1,
      unit: 'box',
      perUnit: 100,
      priceCents: 700,
      massKg: 0.002,
    },
    {
      id: 'screw-top',
      name: 'Cabinet screws #8 x 1 1/4 in, top to case, box of 100',
      kind: 'screw',
      fastens: 'top',
      lengthIn: 1.25,
      unit: 'box',
      perUnit: 100,
      priceCents: 750,
      massKg: 0.003,
    },
    {
      id: 'bolt-caster',
      name: 'Hex bolts 1/4-20 x 1 1/2 in with nuts and washers, for caster plates, box of 50',
      kind: 'bolt',
      fastens: 'caster',
      lengthIn: 1.5,
      unit: 'box',
      perUnit: 50,
      priceCents: 1400,
      massKg: 0.02,
    },
    {
      id: 'screw-foot',
      name: 'Pan-head screws #10 x 3/4 in, for leveling-foot plates, box of 100',
      kind: 'screw',
      fastens: 'foot',
      lengthIn: 0.75,
      unit: 'box',
      perUnit: 100,
      priceCents: 650,
      massKg: 0.002,
    },
    {
      id: 'rail-screw',
      name: 'Cabinet screw, 2 1/2 in',
      kind: 'rail_screw',
      unit: 'each',
      priceCents: 25,
      massKg: 0.01,
    },
    {
      id: 'case-connector',
      name: 'Cabinet connector bolt and sleeve, 1 1/4 to 2 in',
      kind: 'connector',
      unit: 'each',
      priceCents: 45,
      massKg: 0.01,
    },
    {
      id: 'anti-tip-kit',
      name: 'Anti-tip wall anchor kit',
      kind: 'anti_tip_kit',
      unit: 'set',
      priceCents: 900,
      massKg: 0.1,
    },
  ],
  finishes: [
    {
      id: 'waterborne-poly',
      name: 'Waterborne polyurethane, satin',
      volumeSolids: 0.33,
      dryFilmMilsPerCoat: 1.2,
      transferEfficiency: 0.65,
      defaultCoats: 3,
      pricePerGallonCents: 6800,
    },
    {
      id: 'hardwax-oil',
      name: 'Hardwax oil',
      volumeSolids: 0.5,
      dryFilmMilsPerCoat: 0.6,
      transferEfficiency: 0.9,
      defaultCoats: 2,
      pricePerGallonCents: 11200,
    },
  ],
  // Time standards: invented for the demo, set so that a skilled one-person shop's usual times come out
  // (a plain 24 in base cabinet in a working day or so, a double-sided assembly bench in one to two weeks:
  // common practice).
  labour: [
    { key: 'job-setup', name: 'Job set-up and material order', driver: 'job', minutes: 45, stage: 'material' },
    { key: 'sheet-breakdown', name: 'Break down sheets', driver: 'sheet', minutes: 12, stage: 'cutting' },
    { key: 'part-cut', name: 'Cut parts to size', driver: 'part', minutes: 2.5, stage: 'cutting' },
    { key: 'dado-groove', name: 'Cut dados and grooves', driver: 'dado_metre', minutes: 3, stage: 'cutting' },
    { key: 'shelf-pin-rows', name: 'Drill shelf-pin rows', driver: 'shelf_pin_row', minutes: 5, stage: 'casework' },
    { key: 'edge-banding', name: 'Edge banding', driver: 'banding_metre', minutes: 1.5, stage: 'casework' },
    { key: 'pocket-holes', name: 'Pocket holes', driver: 'pocket_hole', minutes: 0.5, stage: 'casework' },
    { key: 'case-assembly', name: 'Glue up and square cases', driver: 'case', minutes: 60, stage: 'casework' },
    { key: 'torsion-top', name: 'Build torsion-box top', driver: 'torsion_top_m2', minutes: 240, stage: 'casework' },
    { key: 'milling', name: 'Mill rough lumber', driver: 'board_foot_milled', minutes: 6, stage: 'cutting' },
    { key: 'trim', name: 'Fit solid trim', driver: 'trim_piece', minutes: 15, stage: 'casework' },
    { key: 'casters', name: 'Fit casters and feet', driver: 'caster', minutes: 10, stage: 'casework' },
    { key: 'drawer-boxes', name: 'Build drawer boxes', driver: 'drawer_box', minutes: 40, stage: 'drawers_doors' },
    { key: 'slides', name: 'Fit slides', driver: 'slide_pair', minutes: 20, stage: 'drawers_doors' },
    { key: 'hinge-boring', name: 'Bore and fit hinges', driver: 'hinge_bored', minutes: 5, stage: 'drawers_doors' },
    { key: 'door-hang', name: 'Hang doors', driver: 'door_hung', minutes: 20, stage: 'drawers_doors' },
    { key: 'front-align', name: 'Align fronts', driver: 'front_aligned', minutes: 10, stage: 'drawers_doors' },
    { key: 'pulls', name: 'Fit pulls', driver: 'pull_fitted', minutes: 6, stage: 'drawers_doors' },
    { key: 'sanding', name: 'Sand for finish', driver: 'sanded_m2', minutes: 5, stage: 'finish' },
    { key: 'finish-coat', name: 'Finish, per coat', driver: 'finish_m2_coat', minutes: 5, stage: 'finish' },
    { key: 'final-check', name: 'Final check and wrap', driver: 'job', minutes: 20, stage: 'ready' },
  ],
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
  shopRateCents: 8500,
  labourCostPerHourCents: 3800,
  kerfMm: 3.2,
  sheetTrimMm: 6,
});
