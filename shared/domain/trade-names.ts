// The trade's names for the codes of an order's spec (process, material, plating, fittings,
// packaging) in each language the product speaks. The screens' words (src/lib/i18n/common) and
// the printed travellers and packing lists (server/lib/print-words.ts) both take them from here,
// so a name is written once per language.
import type { Locale, Material, Plating, Process } from './vocabulary';

export type Packaging = 'bulk' | 'individual_bag' | 'backing_card' | 'gift_box';
export type Backing = 'butterfly_clutch' | 'rubber_clutch' | 'locking_clutch' | 'magnet' | 'safety_pin' | 'screw_nut' | 'none';

export interface TradeNames {
  process: Record<Process, string>;
  material: Record<Material, string>;
  plating: Record<Plating, string>;
  backing: Record<Backing, string>;
  packaging: Record<Packaging, string>;
}

/** English: the screens' words and the printed ones */
export const TRADE_NAMES_EN = {
  process: { hard_enamel: 'Hard enamel', soft_enamel: 'Soft enamel', die_struck: 'Die-struck', printed: 'Printed', die_cast_3d: '3D die-cast' },
  material: { iron: 'Iron', brass: 'Brass', copper: 'Copper', zinc_alloy: 'Zinc alloy' },
  plating: {
    gold: 'Gold',
    silver: 'Silver',
    nickel: 'Nickel',
    black_nickel: 'Black nickel',
    copper: 'Copper',
    antique_gold: 'Antique gold',
    antique_silver: 'Antique silver',
    antique_copper: 'Antique copper',
    antique_bronze: 'Antique bronze',
    dyed: 'Dyed black',
    rainbow: 'Rainbow',
  },
  backing: {
    butterfly_clutch: 'Butterfly clutch',
    rubber_clutch: 'Rubber clutch',
    locking_clutch: 'Locking clutch',
    magnet: 'Magnet',
    safety_pin: 'Safety pin',
    screw_nut: 'Screw and nut',
    none: 'No backing',
  },
  packaging: { bulk: 'Bulk', individual_bag: 'Individual bag', backing_card: 'Backing card', gift_box: 'Gift box' },
};

export const TRADE_NAMES_ZH: typeof TRADE_NAMES_EN = {
  process: { hard_enamel: '硬珐琅', soft_enamel: '软珐琅（烤漆）', die_struck: '冲压', printed: '印刷', die_cast_3d: '3D 压铸' },
  material: { iron: '铁', brass: '黄铜', copper: '紫铜', zinc_alloy: '锌合金' },
  plating: {
    gold: '镀金',
    silver: '镀银',
    nickel: '镀镍',
    black_nickel: '镀黑镍',
    copper: '镀铜',
    antique_gold: '古金',
    antique_silver: '古银',
    antique_copper: '古铜',
    antique_bronze: '青古铜',
    dyed: '染黑',
    rainbow: '彩虹电镀',
  },
  backing: {
    butterfly_clutch: '蝴蝶扣',
    rubber_clutch: '胶扣',
    locking_clutch: '锁扣',
    magnet: '磁铁',
    safety_pin: '别针',
    screw_nut: '螺丝螺母',
    none: '无配件',
  },
  packaging: { bulk: '散装', individual_bag: '独立袋装', backing_card: '背卡', gift_box: '礼盒' },
};

export const TRADE_NAMES: Record<Locale, TradeNames> = { en: TRADE_NAMES_EN, 'zh-CN': TRADE_NAMES_ZH };
