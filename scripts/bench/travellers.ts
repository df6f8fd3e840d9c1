// Time to build the travellers PDF of a 100-tray order (target: under 3 s on the shared
// 2-core machine). Called by `npm run bench`; also runnable alone: npx tsx scripts/bench/travellers.ts
import { performance } from 'node:perf_hooks';
import { PNG } from 'pngjs';
import { renderTravellersPdf, type TravellerCard, type TravellerLayout } from '../../server/lib/traveller-pdf';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting } from '../../shared/domain/routing';
import { makeTravellerCode } from '../../shared/domain/traveller-code';
import { trayNumber } from '../../shared/domain/trays';

/** A 400 × 400 px artwork thumbnail, the size a proof image typically has after upload. */
function artwork(): Buffer {
  const png = new PNG({ width: 400, height: 400 });
  for (let y = 0; y < 400; y++) {
    for (let x = 0; x < 400; x++) {
      const i = (y * 400 + x) * 4;
      const inside = (x - 200) ** 2 + (y - 200) ** 2 < 180 ** 2;
      png.data[i] = inside ? 27 + ((x * 3) % 60) : 255;
      png.data[i + 1] = inside ? 42 + ((y * 5) % 80) : 255;
      png.data[i + 2] = inside ? 74 : 255;
      png.data[i + 3] = 255;
    }
  }
  return PNG.sync.write(png);
}

export function benchCards(n = 100): TravellerCard[] {
  const colours = [
    { name: 'Navy', ref: 'C-281', hex: '#1b2a4a' },
    { name: 'White', hex: '#ffffff' },
    { name: 'Signal red', hex: '#c8102e' },
    { name: 'Leaf', hex: '#3a7d44' },
  ];
  const routing = expandRouting(DEFAULT_ROUTING_TEMPLATES.hard_enamel, {
    process: 'hard_enamel',
    colours,
    backLogo: true,
    printing: true,
    epoxy: false,
    backing: { type: 'butterfly_clutch', count: 2 },
    plating: 'gold',
    secondPlating: null,
    sandblast: false,
  });
  const art = artwork();
  const key = 'bench-key-0123456789abcdefghijklmn';
  return Array.from({ length: n }, (_, i) => {
    const number = trayNumber('24117', i + 1);
    return {
      kind: 'tray' as const,
      number,
      code: makeTravellerCode({ number, revision: 1 }, key),
      revision: 1,
      orderNumber: '24117',
      customer: 'Northfield Lantern Society',
      title: 'Anniversary lantern badge, 30 mm',
      quantity: 100,
      caption: `Tray ${i + 1} of ${n}`,
      process: 'hard_enamel',
      material: 'iron',
      sizeMm: 30,
      colours,
      plating: 'antique_gold',
      fittings: '2 × butterfly clutch',
      packaging: 'individual_bag',
      dueDate: '2026-05-15',
      routing,
      artwork: art,
    };
  });
}

/** Builds a 100-tray travellers PDF and reports how long it took and how large it is. */
export async function benchTravellers(layout: TravellerLayout = 'a6'): Promise<{ ms: number; bytes: number }> {
  const cards = benchCards(100);
  const t0 = performance.now();
  const pdf = await renderTravellersPdf(cards, layout);
  const ms = performance.now() - t0;
  return { ms: Math.round(ms), bytes: pdf.length };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const layout of ['a6', 'a4x4'] as const) {
    // first run warms up fonts and the JIT; report the second
    await benchTravellers(layout);
    const r = await benchTravellers(layout);
    console.log(`travellers PDF, 100 trays, ${layout}: ${r.ms} ms, ${(r.bytes / 1024).toFixed(0)} KiB`);
  }
}
