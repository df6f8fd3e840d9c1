// Printed travellers: the sheet layouts a planner can choose.
export const TRAVELLER_LAYOUT_VALUES = ['a6', 'a4x2', 'a4x4'] as const;
export type TravellerLayoutValue = (typeof TRAVELLER_LAYOUT_VALUES)[number];

export const TRAVELLER_LAYOUT_LABELS: Record<TravellerLayoutValue, string> = {
  a6: 'A6 cards, one per page',
  a4x2: 'A4, two cards (A5) per sheet',
  a4x4: 'A4, four cards (A6) per sheet',
};
