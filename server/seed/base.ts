import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { stations } from '../db/schema/stations';
import { reasonCodes, routingTemplates, settings } from '../db/schema/reference-data';
import { users } from '../db/schema/users';
import { hashSecret } from '../services/auth.service';
import { DEFAULT_ROUTING_TEMPLATES } from '@shared/domain/routing';
import { PROCESSES, type StationKind } from '@shared/domain/vocabulary';

const GENERAL = 'Local regulations and this factory’s own procedures take precedence over these notes.';

/** Default stations (admins change them). Safety text stays general on purpose. */
export const DEFAULT_STATIONS: { code: string; name: string; kind: StationKind; capacityTrays: number; continuous?: boolean; instructions: string; safetyNotes: string }[] = [
  { code: 'ENG-1', name: 'Mould engraving', kind: 'engrave', capacityTrays: 3, instructions: 'Engrave the die from the approved proof; log each cutter change.', safetyNotes: `Guard the spindle; wear eye protection; keep hands clear of the cutter. ${GENERAL}` },
  { code: 'MCK-1', name: 'Mould check', kind: 'mould_check', capacityTrays: 2, instructions: 'Strike a test piece, compare against the proof, record the storage shelf.', safetyNotes: GENERAL },
  { code: 'STR-1', name: 'Die striking', kind: 'strike', capacityTrays: 4, instructions: 'Check the mould number against the traveller before the first strike.', safetyNotes: `Presses can crush hands: use two-hand controls and guards; never reach into the die area. Hearing protection. ${GENERAL}` },
  { code: 'CST-1', name: 'Zinc die casting', kind: 'cast', capacityTrays: 1, instructions: 'Pre-heat the die; check the first shot for fill and flash.', safetyNotes: `Molten zinc alloy burns and splashes: face shield, heat-resistant gloves and apron; keep water away from the melt; ventilate fumes. ${GENERAL}` },
  { code: 'TRM-1', name: 'Trimming', kind: 'trim', capacityTrays: 2, instructions: 'Trim flash to the outline; keep offcuts for recycling.', safetyNotes: `Sharp edges and cutting tools: cut-resistant gloves, eye protection. ${GENERAL}` },
  { code: 'PST-1', name: 'Post fitting', kind: 'post', capacityTrays: 2, instructions: 'Solder posts square to the back; check pull strength on the first piece.', safetyNotes: `Soldering heat and fumes: use fume extraction and heat-resistant mats. ${GENERAL}` },
  { code: 'SLD-1', name: 'Pin soldering', kind: 'solder', capacityTrays: 2, instructions: 'Solder the safety pin centred on the back, hinge and catch level; check the pin opens and locks on the first piece.', safetyNotes: `Solder and flux fumes are harmful: work under fume extraction, keep the iron in its stand, use heat-resistant mats and eye protection; wash hands after handling solder. ${GENERAL}` },
  { code: 'FIL-1', name: 'Colour fill bench 1', kind: 'fill', capacityTrays: 2, instructions: 'Fill only the colour named on the step; match the swatch on the traveller.', safetyNotes: `Enamel pigments: gloves, no food at the bench, wash hands after. ${GENERAL}` },
  { code: 'FIL-2', name: 'Colour fill bench 2', kind: 'fill', capacityTrays: 2, instructions: 'Fill only the colour named on the step; match the swatch on the traveller.', safetyNotes: `Enamel pigments: gloves, no food at the bench, wash hands after. ${GENERAL}` },
  { code: 'OVN-1', name: 'Curing oven', kind: 'cure', capacityTrays: 12, continuous: true, instructions: 'Load trays flat; the tablet counts down the cure time of each tray.', safetyNotes: `Hot surfaces and trays: heat-resistant gloves; let trays cool before handling. ${GENERAL}` },
  { code: 'STN-1', name: 'Stoning', kind: 'stone', capacityTrays: 2, instructions: 'Grind enamel flush with the metal lines; keep the stone wet.', safetyNotes: `Abrasive wheels: guards and eye protection; wet grinding keeps dust down. ${GENERAL}` },
  { code: 'POL-1', name: 'Polishing', kind: 'polish', capacityTrays: 2, instructions: 'Polish on the wheel until the lines are bright.', safetyNotes: `Polishing wheels can snatch parts: no loose sleeves or gloves near the wheel; eye protection. ${GENERAL}` },
  { code: 'SBL-1', name: 'Sandblasting', kind: 'sandblast', capacityTrays: 2, instructions: 'Mask the areas to stay bright; blast only the recessed field to an even matt texture; blow the pieces clean.', safetyNotes: `Blasting dust and rebounding grit harm lungs and eyes: keep the cabinet closed with its extraction running, wear eye protection and a dust mask, check gloves and the window for wear; never point the nozzle at anyone. ${GENERAL}` },
  { code: 'PLT-1', name: 'Plating', kind: 'plate', capacityTrays: 8, instructions: 'Rack the pieces; plate to the finish on the traveller; rinse and dry.', safetyNotes: `Plating baths hold corrosive and toxic chemicals: chemical gloves, goggles, apron, ventilation; follow the bath’s safety data sheets. ${GENERAL}` },
  { code: 'ATQ-1', name: 'Antique oxidising', kind: 'antique', capacityTrays: 4, instructions: 'Dip in the darkening solution for the time on the bath card, rinse, dry, then polish the raised metal bright; compare with the finish sample.', safetyNotes: `Oxidising (darkening) solutions are corrosive and can give off toxic fumes: chemical gloves, goggles and apron; ventilate; never mix with acids; follow the solution’s safety data sheet. ${GENERAL}` },
  { code: 'PRT-1', name: 'Screen printing', kind: 'print', capacityTrays: 2, instructions: 'Register the screen on the first piece; check the print against the proof.', safetyNotes: `Inks and solvents: ventilation and gloves. ${GENERAL}` },
  { code: 'EPX-1', name: 'Epoxy', kind: 'epoxy', capacityTrays: 4, instructions: 'Dome evenly; keep trays level and covered while the epoxy sets.', safetyNotes: `Resins irritate skin and eyes: gloves and eye protection; ventilate. ${GENERAL}` },
  { code: 'INS-1', name: 'Inspection', kind: 'inspect', capacityTrays: 2, instructions: 'Inspect against the proof and the step on the traveller (before plating: fill, stoning and metal; at the end: everything); count good and scrap; record a reason for every scrap.', safetyNotes: GENERAL },
  { code: 'CLU-1', name: 'Clutch fitting', kind: 'clutch', capacityTrays: 2, instructions: 'Fit the backing named on the traveller to every post.', safetyNotes: GENERAL },
  { code: 'BAG-1', name: 'Bagging', kind: 'bag', capacityTrays: 2, instructions: 'Pack as the traveller says: bulk, bag, card or box.', safetyNotes: GENERAL },
  { code: 'PCK-1', name: 'Packing', kind: 'pack', capacityTrays: 4, instructions: 'Count into cartons; write the carton count on the packing list.', safetyNotes: `Lift cartons with a straight back; use the trolley for heavy loads. ${GENERAL}` },
  { code: 'DSP-1', name: 'Dispatch', kind: 'dispatch', capacityTrays: 8, instructions: 'Scan the carrier’s tracking barcode for each shipment.', safetyNotes: GENERAL },
];

export const DEFAULT_REASON_CODES: { code: string; name: string; nameZh: string; kind: 'scrap' | 'rework' | 'hold'; stationKind?: StationKind }[] = [
  { code: 'misstrike', name: 'Mis-strike or double strike', nameZh: '冲压不良', kind: 'scrap', stationKind: 'strike' },
  { code: 'casting_porosity', name: 'Porosity or short fill in casting', nameZh: '压铸气孔或缺料', kind: 'scrap', stationKind: 'cast' },
  { code: 'solder_joint', name: 'Safety pin crooked or joint weak', nameZh: '别针歪斜或焊点不牢', kind: 'scrap', stationKind: 'solder' },
  { code: 'bent_post', name: 'Bent or loose post', nameZh: '针歪或松动', kind: 'scrap', stationKind: 'post' },
  { code: 'colour_bleed', name: 'Colour bled into the next cell', nameZh: '串色', kind: 'scrap' },
  { code: 'underfill', name: 'Enamel underfilled or pitted', nameZh: '填色不足或有坑', kind: 'rework' },
  { code: 'wrong_colour', name: 'Wrong colour filled', nameZh: '填错颜色', kind: 'scrap' },
  { code: 'over_stoned', name: 'Over-ground lines', nameZh: '磨过头', kind: 'scrap', stationKind: 'stone' },
  { code: 'blast_uneven', name: 'Texture patchy or blasted onto bright areas', nameZh: '喷砂不均或喷到亮面', kind: 'scrap', stationKind: 'sandblast' },
  { code: 'plating_defect', name: 'Plating patchy, stained or blistered', nameZh: '电镀不良', kind: 'scrap', stationKind: 'plate' },
  { code: 'antique_uneven', name: 'Antique finish patchy or polished through', nameZh: '仿古色不均或抛穿', kind: 'scrap', stationKind: 'antique' },
  { code: 'print_misregister', name: 'Print off register', nameZh: '印刷错位', kind: 'scrap', stationKind: 'print' },
  { code: 'epoxy_bubble', name: 'Bubble or dust in epoxy', nameZh: '滴胶有气泡或灰尘', kind: 'scrap', stationKind: 'epoxy' },
  { code: 'scratch', name: 'Scratched or dented', nameZh: '划伤或凹痕', kind: 'scrap' },
  { code: 'counting_loss', name: 'Lost in handling (counted short)', nameZh: '搬运遗失', kind: 'scrap' },
  { code: 'hold_quality', name: 'Quality question: wait for a decision', nameZh: '质量问题待定', kind: 'hold' },
  { code: 'hold_customer', name: 'Customer asked to wait', nameZh: '客户要求暂停', kind: 'hold' },
  { code: 'hold_material', name: 'Waiting for material or fittings', nameZh: '等待材料或配件', kind: 'hold' },
];

/** Stations, reason codes, routing templates, settings and the first admin: what every install needs. */
export function seedBase(deps: AppDeps) {
  const { db, env } = deps;
  const now = deps.now();
  db.transaction((tx) => {
    for (const s of DEFAULT_STATIONS) {
      tx.insert(stations).values({ id: crypto.randomUUID(), ...s, continuous: s.continuous ?? false, createdAt: now, updatedAt: now }).run();
    }
    for (const r of DEFAULT_REASON_CODES) tx.insert(reasonCodes).values({ ...r, stationKind: r.stationKind ?? null }).run();
    for (const process of PROCESSES) {
      const t = DEFAULT_ROUTING_TEMPLATES[process];
      tx.insert(routingTemplates).values({ process, name: t.name, template: t, updatedAt: now }).run();
    }
    tx.insert(settings).values({ key: 'factory', value: { name: 'Trayce factory', timeZone: 'Asia/Shanghai' } }).onConflictDoNothing().run();
    tx.insert(users)
      .values({
        id: crypto.randomUUID(),
        name: 'Administrator',
        email: env.adminEmail.toLowerCase(),
        role: 'admin',
        passwordHash: hashSecret(env.adminPassword),
        createdAt: now,
        updatedAt: now,
      })
      .run();
  });
}
