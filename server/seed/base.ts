import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import { stations } from '../db/schema/stations';
import { reasonCodes, routingTemplates, settings } from '../db/schema/reference-data';
import { users } from '../db/schema/users';
import { hashSecret } from '../services/auth.service';
import { DEFAULT_ADMIN_PASSWORD } from '../env';
import { DEFAULT_ROUTING_TEMPLATES } from '@shared/domain/routing';
import { PROCESSES, type StationKind } from '@shared/domain/vocabulary';
import { DEFAULT_TIME_ZONE } from '@shared/domain/time-zone';

const GENERAL = 'Local regulations and this factory’s own procedures take precedence over these notes.';
const GENERAL_ZH = '当地法规和本厂自己的规程优先于这些说明。';

/** Default stations (admins change them). Safety text stays general on purpose. */
export const DEFAULT_STATIONS: {
  code: string;
  name: string;
  nameZh: string;
  kind: StationKind;
  capacityTrays: number;
  continuous?: boolean;
  instructions: string;
  safetyNotes: string;
  instructionsZh: string;
  safetyNotesZh: string;
}[] = [
  {
    code: 'ENG-1',
    name: 'Mould engraving',
    nameZh: '模具雕刻',
    kind: 'engrave',
    capacityTrays: 3,
    instructions: 'Engrave the die from the approved proof; log each cutter change.',
    safetyNotes: `Guard the spindle; wear eye protection; keep hands clear of the cutter. ${GENERAL}`,
    instructionsZh: '按已批准的稿样雕刻模具；每次换刀都要记录。',
    safetyNotesZh: `护好主轴；戴护目镜；手远离刀具。${GENERAL_ZH}`,
  },
  {
    code: 'MCK-1',
    name: 'Mould check',
    nameZh: '模具检验',
    kind: 'mould_check',
    capacityTrays: 2,
    instructions: 'Strike a test piece, compare against the proof, record the storage shelf.',
    safetyNotes: GENERAL,
    instructionsZh: '试冲一件，与稿样比对，记录存放货架。',
    safetyNotesZh: GENERAL_ZH,
  },
  {
    code: 'STR-1',
    name: 'Die striking',
    nameZh: '冲压',
    kind: 'strike',
    capacityTrays: 4,
    instructions: 'Check the mould number against the traveller before the first strike.',
    safetyNotes: `Presses can crush hands: use two-hand controls and guards; never reach into the die area. Hearing protection. ${GENERAL}`,
    instructionsZh: '第一次冲压前核对模具编号与流程卡。',
    safetyNotesZh: `冲床会压伤手：使用双手操作和防护罩；切勿伸手进入模具区。戴听力保护。${GENERAL_ZH}`,
  },
  {
    code: 'CST-1',
    name: 'Zinc die casting',
    nameZh: '锌合金压铸',
    kind: 'cast',
    capacityTrays: 1,
    instructions: 'Pre-heat the die; check the first shot for fill and flash.',
    safetyNotes: `Molten zinc alloy burns and splashes: face shield, heat-resistant gloves and apron; keep water away from the melt; ventilate fumes. ${GENERAL}`,
    instructionsZh: '预热模具；检查第一模的充填和飞边。',
    safetyNotesZh: `熔融锌合金会烫伤和飞溅：戴面罩、耐热手套和围裙；熔液附近不得有水；排出烟气。${GENERAL_ZH}`,
  },
  {
    code: 'TRM-1',
    name: 'Trimming',
    nameZh: '修边',
    kind: 'trim',
    capacityTrays: 2,
    instructions: 'Trim flash to the outline; keep offcuts for recycling.',
    safetyNotes: `Sharp edges and cutting tools: cut-resistant gloves, eye protection. ${GENERAL}`,
    instructionsZh: '沿轮廓修去飞边；边角料留作回收。',
    safetyNotesZh: `锋利边缘和刀具：戴防割手套和护目镜。${GENERAL_ZH}`,
  },
  {
    code: 'PST-1',
    name: 'Post fitting',
    nameZh: '焊针',
    kind: 'post',
    capacityTrays: 2,
    instructions: 'Solder posts square to the back; check pull strength on the first piece.',
    safetyNotes: `Soldering heat and fumes: use fume extraction and heat-resistant mats. ${GENERAL}`,
    instructionsZh: '把针焊正在背面；首件检查拉力。',
    safetyNotesZh: `焊接高温和烟气：使用排烟装置和耐热垫。${GENERAL_ZH}`,
  },
  {
    code: 'SLD-1',
    name: 'Pin soldering',
    nameZh: '焊别针',
    kind: 'solder',
    capacityTrays: 2,
    instructions: 'Solder the safety pin centred on the back, hinge and catch level; check the pin opens and locks on the first piece.',
    safetyNotes: `Solder and flux fumes are harmful: work under fume extraction, keep the iron in its stand, use heat-resistant mats and eye protection; wash hands after handling solder. ${GENERAL}`,
    instructionsZh: '把别针焊在背面正中，铰链和扣位对齐；首件检查别针能打开并扣牢。',
    safetyNotesZh: `焊锡和助焊剂烟气有害：在排烟装置下操作，烙铁放回支架，使用耐热垫和护目镜；接触焊锡后洗手。${GENERAL_ZH}`,
  },
  {
    code: 'FIL-1',
    name: 'Colour fill bench 1',
    nameZh: '填色台 1',
    kind: 'fill',
    capacityTrays: 2,
    instructions: 'Fill only the colour named on the step; match the swatch on the traveller.',
    safetyNotes: `Enamel pigments: gloves, no food at the bench, wash hands after. ${GENERAL}`,
    instructionsZh: '只填工序上写明的颜色；对照流程卡上的色样。',
    safetyNotesZh: `珐琅颜料：戴手套，工作台不放食物，完工后洗手。${GENERAL_ZH}`,
  },
  {
    code: 'FIL-2',
    name: 'Colour fill bench 2',
    nameZh: '填色台 2',
    kind: 'fill',
    capacityTrays: 2,
    instructions: 'Fill only the colour named on the step; match the swatch on the traveller.',
    safetyNotes: `Enamel pigments: gloves, no food at the bench, wash hands after. ${GENERAL}`,
    instructionsZh: '只填工序上写明的颜色；对照流程卡上的色样。',
    safetyNotesZh: `珐琅颜料：戴手套，工作台不放食物，完工后洗手。${GENERAL_ZH}`,
  },
  {
    code: 'OVN-1',
    name: 'Curing oven',
    nameZh: '烤炉',
    kind: 'cure',
    capacityTrays: 12,
    continuous: true,
    instructions: 'Load trays flat; the tablet counts down the cure time of each tray.',
    safetyNotes: `Hot surfaces and trays: heat-resistant gloves; let trays cool before handling. ${GENERAL}`,
    instructionsZh: '托盘平放入炉；平板会为每盘倒计时烘烤时间。',
    safetyNotesZh: `表面和托盘很烫：戴耐热手套；托盘冷却后再拿。${GENERAL_ZH}`,
  },
  {
    code: 'STN-1',
    name: 'Stoning',
    nameZh: '磨石',
    kind: 'stone',
    capacityTrays: 2,
    instructions: 'Grind enamel flush with the metal lines; keep the stone wet.',
    safetyNotes: `Abrasive wheels: guards and eye protection; wet grinding keeps dust down. ${GENERAL}`,
    instructionsZh: '把珐琅磨平到与金属线齐平；磨石保持湿润。',
    safetyNotesZh: `砂轮：使用防护罩和护目镜；湿磨可减少粉尘。${GENERAL_ZH}`,
  },
  {
    code: 'POL-1',
    name: 'Polishing',
    nameZh: '抛光',
    kind: 'polish',
    capacityTrays: 2,
    instructions: 'Polish on the wheel until the lines are bright.',
    safetyNotes: `Polishing wheels can snatch parts: no loose sleeves or gloves near the wheel; eye protection. ${GENERAL}`,
    instructionsZh: '在抛光轮上抛到线条发亮。',
    safetyNotesZh: `抛光轮会卷走工件：轮旁不得有宽松袖口或手套；戴护目镜。${GENERAL_ZH}`,
  },
  {
    code: 'SBL-1',
    name: 'Sandblasting',
    nameZh: '喷砂',
    kind: 'sandblast',
    capacityTrays: 2,
    instructions: 'Mask the areas to stay bright; blast only the recessed field to an even matt texture; blow the pieces clean.',
    safetyNotes: `Blasting dust and rebounding grit harm lungs and eyes: keep the cabinet closed with its extraction running, wear eye protection and a dust mask, check gloves and the window for wear; never point the nozzle at anyone. ${GENERAL}`,
    instructionsZh: '遮住要保持光亮的部位；只喷凹下的底面，得到均匀的哑光纹理；把工件吹干净。',
    safetyNotesZh: `喷砂粉尘和反弹的砂粒伤肺伤眼：保持喷砂柜关闭并开着抽风，戴护目镜和防尘口罩，检查手套和视窗有无磨损；喷嘴绝不对着人。${GENERAL_ZH}`,
  },
  {
    code: 'PLT-1',
    name: 'Plating',
    nameZh: '电镀',
    kind: 'plate',
    capacityTrays: 8,
    instructions: 'Rack the pieces; plate to the finish on the traveller; rinse and dry.',
    safetyNotes: `Plating baths hold corrosive and toxic chemicals: chemical gloves, goggles, apron, ventilation; follow the bath’s safety data sheets. ${GENERAL}`,
    instructionsZh: '挂好工件；按流程卡上的表面处理电镀；冲洗并烘干。',
    safetyNotesZh: `电镀槽含有腐蚀性和有毒化学品：戴防化手套、护目镜、围裙，保持通风；遵守镀槽的安全数据表。${GENERAL_ZH}`,
  },
  {
    code: 'ATQ-1',
    name: 'Antique oxidising',
    nameZh: '仿古氧化',
    kind: 'antique',
    capacityTrays: 4,
    instructions:
      'Dip in the darkening solution for the time on the bath card, rinse, dry, then polish the raised metal bright; compare with the finish sample.',
    safetyNotes: `Oxidising (darkening) solutions are corrosive and can give off toxic fumes: chemical gloves, goggles and apron; ventilate; never mix with acids; follow the solution’s safety data sheet. ${GENERAL}`,
    instructionsZh: '按槽卡上的时间浸入发黑溶液，冲洗、烘干，再把凸起的金属抛亮；与表面样板比对。',
    safetyNotesZh: `氧化（发黑）溶液有腐蚀性，可能放出有毒烟气：戴防化手套、护目镜和围裙；保持通风；绝不与酸混合；遵守溶液的安全数据表。${GENERAL_ZH}`,
  },
  {
    code: 'PRT-1',
    name: 'Screen printing',
    nameZh: '丝印',
    kind: 'print',
    capacityTrays: 2,
    instructions: 'Register the screen on the first piece; check the print against the proof.',
    safetyNotes: `Inks and solvents: ventilation and gloves. ${GENERAL}`,
    instructionsZh: '首件对准网版；对照稿样检查印刷。',
    safetyNotesZh: `油墨和溶剂：保持通风并戴手套。${GENERAL_ZH}`,
  },
  {
    code: 'EPX-1',
    name: 'Epoxy',
    nameZh: '滴胶',
    kind: 'epoxy',
    capacityTrays: 4,
    instructions: 'Dome evenly; keep trays level and covered while the epoxy sets.',
    safetyNotes: `Resins irritate skin and eyes: gloves and eye protection; ventilate. ${GENERAL}`,
    instructionsZh: '滴胶均匀；胶固化时托盘保持水平并盖好。',
    safetyNotesZh: `树脂刺激皮肤和眼睛：戴手套和护目镜；保持通风。${GENERAL_ZH}`,
  },
  {
    code: 'INS-1',
    name: 'Inspection',
    nameZh: '检验',
    kind: 'inspect',
    capacityTrays: 2,
    instructions:
      'Inspect against the proof and the step on the traveller (before plating: fill, stoning and metal; at the end: everything); count good and scrap; record a reason for every scrap.',
    safetyNotes: GENERAL,
    instructionsZh: '对照稿样和流程卡上的工序检验（电镀前：填色、磨石和金属；最后：全部）；清点良品和报废；每件报废都要记录原因。',
    safetyNotesZh: GENERAL_ZH,
  },
  {
    code: 'CLU-1',
    name: 'Clutch fitting',
    nameZh: '装扣',
    kind: 'clutch',
    capacityTrays: 2,
    instructions: 'Fit the backing named on the traveller to every post.',
    safetyNotes: GENERAL,
    instructionsZh: '给每根针装上流程卡写明的背扣。',
    safetyNotesZh: GENERAL_ZH,
  },
  {
    code: 'BAG-1',
    name: 'Bagging',
    nameZh: '装袋',
    kind: 'bag',
    capacityTrays: 2,
    instructions: 'Pack as the traveller says: bulk, bag, card or box.',
    safetyNotes: GENERAL,
    instructionsZh: '按流程卡包装：散装、袋装、卡装或盒装。',
    safetyNotesZh: GENERAL_ZH,
  },
  {
    code: 'PCK-1',
    name: 'Packing',
    nameZh: '装箱',
    kind: 'pack',
    capacityTrays: 4,
    instructions: 'Count into cartons; write the carton count on the packing list.',
    safetyNotes: `Lift cartons with a straight back; use the trolley for heavy loads. ${GENERAL}`,
    instructionsZh: '点数装箱；在装箱单上写明箱数。',
    safetyNotesZh: `搬箱时背部挺直；重物用推车。${GENERAL_ZH}`,
  },
  {
    code: 'DSP-1',
    name: 'Dispatch',
    nameZh: '发货',
    kind: 'dispatch',
    capacityTrays: 8,
    instructions: 'Scan the carrier’s tracking barcode for each shipment.',
    safetyNotes: GENERAL,
    instructionsZh: '为每票货扫描承运商的运单条码。',
    safetyNotesZh: GENERAL_ZH,
  },
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

/**
 * Stations, reason codes, routing templates, settings and the first admin: what every install
 * needs. A first admin given the documented default password must change it at first sign-in;
 * `firstAdmin: false` leaves the admin out (the demo factory brings its own).
 */
export async function seedBase(deps: AppDeps, options: { firstAdmin?: boolean } = {}): Promise<void> {
  const { db, env } = deps;
  const now = deps.now();
  const adminHash = options.firstAdmin === false ? null : await hashSecret(env.adminPassword);
  db.transaction((tx) => {
    for (const s of DEFAULT_STATIONS) {
      tx.insert(stations)
        .values({ id: crypto.randomUUID(), ...s, continuous: s.continuous ?? false, createdAt: now, updatedAt: now })
        .run();
    }
    for (const r of DEFAULT_REASON_CODES)
      tx.insert(reasonCodes)
        .values({ ...r, stationKind: r.stationKind ?? null })
        .run();
    for (const process of PROCESSES) {
      const t = DEFAULT_ROUTING_TEMPLATES[process];
      tx.insert(routingTemplates).values({ process, name: t.name, template: t, updatedAt: now }).run();
    }
    tx.insert(settings)
      .values({ key: 'factory', value: { name: 'Trayce factory', timeZone: DEFAULT_TIME_ZONE } })
      .onConflictDoNothing()
      .run();
    if (adminHash == null) return;
    tx.insert(users)
      .values({
        id: crypto.randomUUID(),
        name: 'Administrator',
        email: env.adminEmail.toLowerCase(),
        role: 'admin',
        passwordHash: adminHash,
        mustChangePassword: env.adminPassword === DEFAULT_ADMIN_PASSWORD,
        createdAt: now,
        updatedAt: now,
      })
      .run();
  });
}
