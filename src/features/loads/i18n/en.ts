// Oven and plating load words, in English. zh-CN.ts has the same keys.
export const en = {
  title: 'Oven & bath loads',
  subtitle: 'Trays waiting for the oven, by cure profile, and for plating, by finish: choose trays from any orders to fill a load.',
  safety:
    'Ovens are hot and plating baths hold corrosive and toxic chemicals: heat-resistant gloves, goggles and ventilation as the station notes say. Local regulations and the factory’s own procedures take precedence.',
  open: 'Open loads',
  waitingOven: 'Waiting for the oven',
  waitingPlating: 'Waiting for plating',
  noOven: 'No tray waits for the oven',
  noPlating: 'No tray waits for plating',
  cureLabel: '{{minutes}} min cure',
  groupSummary: '{{trays}} trays · {{pieces}} pieces · oldest waiting {{oldest}}',
  traysWaiting: 'Trays waiting: {{title}}',
  choose: 'Choose',
  tray: 'Tray',
  order: 'Order',
  customer: 'Customer',
  pieces: 'Pieces',
  waiting: 'Waiting',
  putIn: 'Put tray {{number}} in the load',
  makeCure: 'Make an oven load of {{count}} trays ({{pieces}} pieces)',
  makePlate: 'Make a plating load of {{count}} trays ({{pieces}} pieces)',
  loadPieces: '{{pieces}} pieces',
  keepsOwn: 'Each order keeps its own trays and pieces; splitting the load gives every order back exactly what it put in.',
  orderLine: 'Order <strong>{{number}}</strong>: {{pieces}} pieces in {{trays}}',
  split: 'Split back into its trays',
};

type Strings<T> = { [K in keyof T]: T[K] extends string ? string : Strings<T[K]> };
export type LoadsStrings = Strings<typeof en>;
