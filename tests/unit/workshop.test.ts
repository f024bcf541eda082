import { describe, expect, it } from 'vitest';
import { angleFromSetup } from '@shared/geometry';
import { angleFromSavedSetup, coolantPlan, kitSharpeningCost, optionCoolants, progressionCoolant, replacementForecast, settingsToday, sharpeningCost, type CoolantStep, type WorkshopWheel } from '@shared/workshop';

const grinder = { id: 1, name: 'Wet grinder', spindleRpm: 90, barDiameterMm: 12 };
const setup = { id: 7, name: 'Kitchen knife 15°', projectionMm: 140, perSideDeg: 15, offsetMm: 0 };
const wheel = (id: number, original: number, diameters: [string, number, number?][] = [], wears = true): WorkshopWheel => ({
  id,
  name: `wheel ${id}`,
  grinderId: 1,
  wears,
  originalDiameterMm: original,
  minDiameterMm: wears ? 180 : null,
  measurements: diameters.map(([measuredOn, diameterMm, sharpenings]) => ({ measuredOn, diameterMm, sharpenings: sharpenings ?? 0, dressed: false })),
});

describe('settings today', () => {
  it('wheels of one diameter share one gap; a worn wheel gets its own, and says how far it moved', () => {
    const cbnA = wheel(1, 250, [], false);
    const cbnB = wheel(2, 250, [], false);
    const worn = wheel(3, 250, [['2026-01-10', 246], ['2026-06-10', 240]]);
    const settings = settingsToday([setup], [cbnA, cbnB, worn], [grinder]);
    expect(settings).toHaveLength(2);
    const shared = settings.find((s) => s.diameterMm === 250)!;
    expect(shared.wheelIds).toEqual([1, 2]);
    const wornSetting = settings.find((s) => s.diameterMm === 240)!;
    // independent check: each gap, put back through the forward formula, grinds the setup's angle
    expect(angleFromSetup({ wheelDiameterMm: 250, barDiameterMm: 12, gapMm: shared.gapMm!, projectionMm: 140 }).perSideDeg).toBeCloseTo(15, 9);
    expect(angleFromSetup({ wheelDiameterMm: 240, barDiameterMm: 12, gapMm: wornSetting.gapMm!, projectionMm: 140 }).perSideDeg).toBeCloseTo(15, 9);
    expect(wornSetting.movedFromNew).toHaveLength(1);
    expect(wornSetting.movedFromNew[0].movedMm).toBeCloseTo(wornSetting.gapMm! - shared.gapMm!, 12);
    // a smaller wheel needs the bar closer to its axis but the rim falls away faster: the gap grows
    expect(wornSetting.movedFromNew[0].movedMm).toBeGreaterThan(0);
  });

  it('leaves out wheels without a grinder, and names why a setup cannot reach a wheel', () => {
    const loose = { ...wheel(4, 250), grinderId: null };
    expect(settingsToday([setup], [loose], [grinder])).toEqual([]);
    const tooShort = settingsToday([{ ...setup, projectionMm: 10, perSideDeg: 5 }], [wheel(5, 250)], [grinder]);
    expect(tooShort[0].gapMm).toBeNull();
    expect(tooShort[0].reason).toMatch(/inside the wheel/);
  });
});

describe('replacement forecast (least squares, by hand)', () => {
  it('a wheel losing 1 mm every 10 days from 250 mm reaches 180 mm 700 days after the first measurement', () => {
    const w = wheel(1, 250, [['2026-01-01', 250], ['2026-01-11', 249], ['2026-01-21', 248]]);
    const f = replacementForecast(w)!;
    expect(f.mmPer30Days).toBeCloseTo(3, 9);
    expect(f.onDate).toBe(new Date(Date.UTC(2026, 0, 1) + 700 * 86400000).toISOString().slice(0, 10));
    expect(f.points).toBe(3);
  });

  it('none for a wheel that keeps its diameter or with one date', () => {
    expect(replacementForecast(wheel(1, 250, [['2026-01-01', 250]]))).toBeNull();
    expect(replacementForecast(wheel(1, 250, [['2026-01-01', 250], ['2026-02-01', 250]], false))).toBeNull();
  });
});

describe('cost per sharpening', () => {
  it('dressable: usable range over diameter lost per sharpening (by hand)', () => {
    // 250 → 246 mm over 40 sharpenings: 0.1 mm each; usable 250 − 180 = 70 mm → 700 sharpenings; 140 / 700 = 0.20
    const w = { ...wheel(1, 250, [['2026-01-01', 250], ['2026-03-01', 246, 40]]), pricePaid: 140 };
    expect(sharpeningCost(w, [])).toEqual({ costPerSharpening: 0.2, expectedSharpenings: 700, basis: 'measured-wear', restsOn: 40, measurements: 2, rough: true });
  });

  it('fixed: the median reported life of retired wheels of the same abrasive, with n', () => {
    const w = { ...wheel(2, 250, [], false), pricePaid: 300 };
    const c = sharpeningCost(w, [1000, 1500, 2000])!;
    expect(c).toMatchObject({ expectedSharpenings: 1500, basis: 'reported-life', restsOn: 3 });
    expect(c.costPerSharpening).toBeCloseTo(0.2, 12);
    expect(sharpeningCost(w, [])).toBeNull();
  });

  it('rough below five measurements, sharpenings or reports; not at five (FEW)', () => {
    const five: [string, number, number?][] = [['2026-01-01', 250], ['2026-02-01', 249, 10], ['2026-03-01', 248, 10], ['2026-04-01', 247, 10], ['2026-05-01', 246, 10]];
    expect(sharpeningCost({ ...wheel(1, 250, five), pricePaid: 140 }, [])).toMatchObject({ costPerSharpening: 0.2, measurements: 5, rough: false });
    expect(sharpeningCost({ ...wheel(2, 250, [], false), pricePaid: 300 }, [1500, 1500, 1500, 1500, 1500])).toMatchObject({ rough: false });
  });
});

describe('the whole kit per sharpening', () => {
  it('sums each active wheel\'s figure per currency and names the wheels left out (worked by hand)', () => {
    // Worked by hand, written here:
    //   vitrified, 140 EUR: 250 → 246 mm over 40 sharpenings = 0.1 mm each; (250 − 180) / 0.1 = 700 sharpenings; 140 / 700 = 0.20 EUR
    //   CBN, 300 EUR: reported lives 1000, 1500, 2000 → median 1500 sharpenings; 300 / 1500 = 0.20 EUR
    //   diamond, 450 EUR: nobody reported a life → no figure, left out (the sum is a lower bound)
    //   fine vitrified, no price → left out
    //   a 90 USD CBN wheel over a median life of 900 → 0.10 USD, summed apart (never converted)
    //   kit: 0.20 + 0.20 = 0.40 EUR a sharpening from 2 wheels; rough, since both rest on fewer than 5
    const vit = sharpeningCost({ ...wheel(1, 250, [['2026-01-01', 250], ['2026-03-01', 246, 40]]), pricePaid: 140 }, []);
    const cbn = sharpeningCost({ ...wheel(2, 250, [], false), pricePaid: 300 }, [1000, 1500, 2000]);
    const diamond = sharpeningCost({ ...wheel(3, 250, [], false), pricePaid: 450 }, []);
    const usd = sharpeningCost({ ...wheel(5, 200, [], false), pricePaid: 90 }, [900]);
    const kit = kitSharpeningCost([
      { wheelId: 1, pricePaid: 140, currency: 'EUR', cost: vit },
      { wheelId: 2, pricePaid: 300, currency: 'EUR', cost: cbn },
      { wheelId: 3, pricePaid: 450, currency: 'EUR', cost: diamond },
      { wheelId: 4, pricePaid: null, currency: null, cost: null },
      { wheelId: 5, pricePaid: 90, currency: 'USD', cost: usd },
    ]);
    expect(kit.byCurrency).toHaveLength(2);
    expect(kit.byCurrency[0]).toMatchObject({ currency: 'EUR', wheelIds: [1, 2], rough: true });
    expect(kit.byCurrency[0].costPerSharpening).toBeCloseTo(0.4, 12);
    expect(kit.byCurrency[1]).toMatchObject({ currency: 'USD', wheelIds: [5], rough: true });
    expect(kit.byCurrency[1].costPerSharpening).toBeCloseTo(0.1, 12);
    expect(kit.missing).toEqual([{ wheelId: 3, why: 'no-estimate' }, { wheelId: 4, why: 'no-price' }]);
  });

  it('not rough when every summed figure rests on five or more; empty kit, empty answer', () => {
    const life = sharpeningCost({ ...wheel(2, 250, [], false), pricePaid: 300 }, [1500, 1500, 1500, 1500, 1500]);
    const kit = kitSharpeningCost([{ wheelId: 2, pricePaid: 300, currency: 'EUR', cost: life }]);
    expect(kit.byCurrency).toEqual([{ currency: 'EUR', costPerSharpening: 0.2, wheelIds: [2], rough: false }]); // 300 / 1500, by hand
    expect(kitSharpeningCost([])).toEqual({ byCurrency: [], missing: [] });
  });
});

describe('coolant along a progression', () => {
  const step = (label: string, coolant: CoolantStep['coolant'], micrometres: number): CoolantStep => ({ label, coolant, micrometres });

  it('names each change, and a same-band swap that saves one (counted by hand)', () => {
    // 98 µm (D107, φ band 3) plain water → 17 µm (band 5) inhibitor → 12 µm (band 6) water → 9 µm (band 6) inhibitor
    const steps = [step('D107', 'water', 98), step('F400', 'water-inhibitor', 17.3), step('JIS 1000', 'water', 11.5), step('B76', 'water-inhibitor', 9)];
    const plan = coolantPlan(steps);
    expect(plan.changes.map((c) => c.afterStep)).toEqual([0, 1, 2]);
    // the two band-6 steps swap: water, inhibitor, inhibitor, water → two changes
    expect(plan.suggested.map((s) => s.label)).toEqual(['D107', 'F400', 'B76', 'JIS 1000']);
    expect(plan.suggestedChanges).toHaveLength(2);
  });

  it('keeps the order as given when nothing would save a change, and never swaps across bands', () => {
    const steps = [step('coarse', 'water', 200), step('fine', 'water-inhibitor', 10), step('finer', 'water', 3)];
    const plan = coolantPlan(steps);
    expect(plan.suggested).toEqual(steps);
    expect(plan.suggestedChanges).toHaveLength(2);
  });
});

describe('the result form\'s angle from a saved setup on a wheel', () => {
  it('gives the setup\'s angle with the gap for that wheel today, which grinds it (forward formula, shared/geometry.ts)', () => {
    const worn = wheel(3, 250, [['2026-01-10', 246], ['2026-06-10', 240]]);
    const settings = settingsToday([setup], [wheel(1, 250, [], false), worn], [grinder]).map(({ setupId: _s, ...rest }) => rest);
    const source = angleFromSavedSetup({ ...setup, settings }, 3);
    if (!('perSideDeg' in source)) throw new Error(source.reason);
    expect(source).toMatchObject({ perSideDeg: 15, diameterMm: 240, barDiameterMm: 12, projectionMm: 140 });
    // independent check: the gap put back through the forward model grinds 15° on the 240 mm wheel
    expect(angleFromSetup({ wheelDiameterMm: 240, barDiameterMm: 12, gapMm: source.gapMm, projectionMm: 140 }).perSideDeg).toBeCloseTo(15, 9);
  });

  it('names why not: a wheel on no grinder, a setup that cannot reach', () => {
    expect(angleFromSavedSetup({ ...setup, settings: [] }, 1)).toEqual({ reason: expect.stringMatching(/no grinder/) });
    const short = { ...setup, projectionMm: 10, perSideDeg: 5 };
    const settings = settingsToday([short], [wheel(5, 250)], [grinder]);
    expect(angleFromSavedSetup({ ...short, settings }, 5)).toEqual({ reason: expect.stringMatching(/inside the wheel/) });
  });
});

describe('coolant along a result\'s progression', () => {
  const step = (label: string, coolant: CoolantStep['coolant'], micrometres: number | null): CoolantStep => ({ label, coolant, micrometres });

  /** Independent solution: every order of the steps that keeps their φ bands coarse to fine, tried one by one. */
  function fewestByBruteForce(steps: CoolantStep[], final: CoolantStep): number {
    const band = (s: CoolantStep) => Math.floor(-Math.log2(s.micrometres! / 1000));
    let best = Infinity;
    const permute = (left: CoolantStep[], done: CoolantStep[]) => {
      if (left.length === 0) {
        const all = [...done, final];
        if (done.some((s, i) => i > 0 && band(s) < band(done[i - 1]))) return;
        best = Math.min(best, all.filter((s, i) => i > 0 && s.coolant !== all[i - 1].coolant).length);
        return;
      }
      left.forEach((s, i) => permute([...left.slice(0, i), ...left.slice(i + 1)], [...done, s]));
    };
    permute(steps, []);
    return best;
  }

  it('ends on the final abrasive, and finds as few changes as trying every order (brute force)', () => {
    // bands: 98 µm → 3, 75 µm → 3, 17 µm → 5, 12 and 9 µm → 6 (⌊−log2(d / 1 mm)⌋, worked by hand)
    const steps = [step('D107', 'water', 98), step('F220', 'water-inhibitor', 75), step('D15', 'water', 17), step('F800', 'water-inhibitor', 12), step('D9', 'water', 9)];
    const final = step('strop', 'water-inhibitor', 9);
    const plan = progressionCoolant(steps, final);
    expect(plan.changes).toHaveLength(5);
    expect(plan.suggestedOrder).toHaveLength(5);
    expect(new Set(plan.suggestedOrder)).toEqual(new Set([0, 1, 2, 3, 4]));
    expect(plan.suggestedChanges).toHaveLength(fewestByBruteForce(steps, final));
    // by hand: F220 (inhibitor), D107 | D15 | D9, F800 (inhibitor) | strop (inhibitor): two changes
    expect(plan.suggestedOrder).toEqual([1, 0, 2, 4, 3]);
    expect(plan.suggestedChanges).toEqual([
      { afterStep: 0, from: 'water-inhibitor', to: 'water' },
      { afterStep: 3, from: 'water', to: 'water-inhibitor' },
    ]);
  });

  it('agrees with the brute force on random progressions (mulberry32, 200 cases)', () => {
    let seed = 7;
    const random = () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const coolants: CoolantStep['coolant'][] = ['water', 'water-inhibitor', 'oil'];
    for (let c = 0; c < 200; c++) {
      const n = 1 + Math.floor(random() * 5);
      const sizes = Array.from({ length: n }, () => 5 + random() * 120).sort((a, b) => b - a);
      const steps = sizes.map((um, i) => step(`s${i}`, coolants[Math.floor(random() * 3)], um));
      const final = step('final', coolants[Math.floor(random() * 3)], 5);
      expect(progressionCoolant(steps, final).suggestedChanges.length).toBe(fewestByBruteForce(steps, final));
    }
  });
});

describe('the coolants of a decision view\'s option (abrasive material at a grit band)', () => {
  // Invented pages; band edges are powers of two in mm (Krumbein's φ): (31.25, 62.5] µm is φ 4 to 5, (7.8125, 15.625] µm φ 6 to 7.
  const pages = [
    { name: 'CBN plated B46', material: 'cbn', gritUm: 46, coolant: 'water-inhibitor' as const },
    { name: 'Diamond plated D46', material: 'diamond', gritUm: 46, coolant: 'water-inhibitor' as const },
    { name: 'Diamond resin 15 µm', material: 'diamond', gritUm: 15, coolant: 'water' as const },
    { name: 'Diamond strop 1 µm', material: 'diamond', gritUm: 1, coolant: 'dry' as const },
    { name: 'Diamond resin 12 µm', material: 'diamond', gritUm: 12, coolant: 'water-inhibitor' as const },
  ];
  const whole = (hiUm: number) => ({ hiUm, step: 1 as const });

  it('takes the pages of the material in the band; several coolants are each named with their pages', () => {
    expect(optionCoolants(pages, { material: 'cbn', band: whole(62.5) })).toEqual({ basis: 'band', coolants: [{ coolant: 'water-inhibitor', pages: ['CBN plated B46'] }] });
    expect(optionCoolants(pages, { material: 'diamond', band: whole(15.625) })).toEqual({
      basis: 'band',
      coolants: [
        { coolant: 'water', pages: ['Diamond resin 15 µm'] },
        { coolant: 'water-inhibitor', pages: ['Diamond resin 12 µm'] },
      ],
    });
  });

  it('falls back to every page of the material when none is in the band; none without a page', () => {
    expect(optionCoolants(pages, { material: 'cbn', band: whole(15.625) })).toEqual({ basis: 'material', coolants: [{ coolant: 'water-inhibitor', pages: ['CBN plated B46'] }] });
    expect(optionCoolants(pages, { material: 'silicon-carbide', band: whole(62.5) })).toEqual({ basis: 'none', coolants: [] });
  });

  it('a size on a band\'s edge belongs to the band it is the coarse edge of, as gritBand says', () => {
    const edge = [{ name: 'edge', material: 'cbn', gritUm: 62.5, coolant: 'water' as const }];
    expect(optionCoolants(edge, { material: 'cbn', band: whole(62.5) }).basis).toBe('band');
    expect(optionCoolants(edge, { material: 'cbn', band: whole(125) }).basis).toBe('material');
  });
});
