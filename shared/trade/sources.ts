// Where each table and rule comes from, as it is cited in results and tests.
// Marks: [pub] a published copy of the named standard or handbook; [mfr] makers' installation
// literature; [memory] recalled, not verified against a copy; [practice] common practice.
// Makers are never named: they are "a manufacturer's installation manual".

export const SOURCES = {
  d1785: 'ASTM D1785, Sch 40/80 table (OD, minimum wall, 73 °F water rating) [pub]',
  f441: 'ASTM F441, same IPS sizes and 73 °F ratings as ASTM D1785 [pub]',
  isoEquation: 'ISO equation P = 2·S·t/(D − t), S = hydrostatic design stress [pub]',
  derating: "a manufacturer's installation manual, temperature de-rating factors [mfr]",
  deratingSecond: "a second manufacturer's installation manual, bracketed de-rating factors [mfr]",
  nextHigherRow: 'between rows, the factor of the next higher listed temperature [practice]',
  maxServiceTemperature: "maximum service temperature PVC 140 °F, CPVC 200 °F, a manufacturer's installation manual [mfr]",
  maxServiceTemperatureAbs: 'maximum service temperature ABS 180 °F, the commonly quoted limit [memory]',
  socketDepth:
    "ASTM D2466 (Sch 40) / ASTM D2467 (Sch 80) minimum socket depth, from a manufacturer's " +
    'installation manual cross-checked against ASTM D2468 [mfr]',
  checkMark: 'check mark about 2 in beyond the insertion mark [practice]',
  dryFit: 'dry fit between 1/3 and 2/3 of socket depth, ASTM F3328 wording for tapered sockets [pub]',
  dryFitMaker: "1/2 to 2/3 of socket depth for 1/2\"–4\", a manufacturer's installation manual [mfr]",
  chamferAngle: "bevel 10°–15°, a manufacturer's installation manual [mfr]",
  chamferLength: 'bevel about 1/16"–3/32" long on small sizes, more on large [memory]',
  cureA: "Schedule A, average initial set and joint cure, a manufacturer's installation manual [mfr]",
  cureB: 'Schedule B, set and cure, a plastics piping technical manual [pub]',
  humidity: "relative humidity above 60%: 50% more set and cure time, a manufacturer's installation manual [mfr]",
  bandEdges:
    'at a band edge the longer time; the lowest temperature counts; nothing outside the table ' +
    'is extrapolated [practice]',
  cementStandards: 'ASTM D2564 (PVC), ASTM F493 (CPVC), ASTM D2235 (ABS); primer ASTM F656 [pub]',
  transitionCement: 'ASTM D3138 transition cement: non-pressure only, 25 psi or less [pub]',
  cementBody: "cement body by largest size: regular ≤2\", medium ≤6\", heavy beyond, a manufacturer's installation manual [mfr]",
  jointsPerQuart: 'average joints per quart of cement, a plastics piping technical manual [pub]',
  primerRatio: 'primer: about twice the joints per quart of cement [pub]',
  applicator: 'applicator about half the pipe diameter; daubers small, swabs or rollers large [practice]',
  crew: 'crew and a mechanical joining device for large diameters [practice]',
  assemblyHold: 'hold the assembled joint at least about 30 s, longer in the cold [practice]',
  shelfLife: "cement shelf life about two years from the stamped date, a manufacturer's installation manual [mfr]",
  testPressure: 'hydrostatic test not less than 1.5 × design pressure, ASME B31.3 A345.4.2 [memory]',
  testCap: 'test not above 1.5 × the lowest component rating, ASME B31.3 A345.4.2 [memory]; or at the rating, plant setting',
  testHold: 'hold the test at least 10 minutes, ASME B31.3 345.2.2(a) [memory]',
  noGasTest: 'a plastic pipe trade association user bulletin; ASTM D1785 §1.2 [pub]',
  solvents: 'ASTM F402, safe handling of solvent cements and primers [pub]',
  lockout: 'OSHA 29 CFR 1910.147 [pub]',
} as const;
