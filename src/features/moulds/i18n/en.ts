// Mould library words, in English. zh-CN.ts has the same keys.
export const en = {
  title: 'Mould library',
  subtitle: 'Every mould made, where it is stored and how often it was used. A repeat order of the same design reuses its mould and skips engraving.',
  filter: 'Find a mould, customer or order',
  caption: 'Mould library',
  empty: 'No moulds yet: they are made when an order is released',
  storageOf: 'Storage place of mould {{number}}',
  storageExample: 'e.g. Shelf B-4',
  save: 'Save',
  retire: 'Retire',
  unretire: 'Put back in use',
  col: {
    number: 'Mould',
    side: 'Side',
    state: 'State',
    storedAt: 'Stored at',
    useCount: 'Orders made',
    customer: 'Customer',
    firstOrder: 'First order',
    lastUsed: 'Last used',
    actions: 'Actions',
  },
  side: {
    front: 'Front',
    back: 'Back',
  },
  status: {
    engraving: 'Engraving',
    checking: 'Checking',
    ready: 'Ready',
    retired: 'Retired',
  },
};

type Strings<T> = { [K in keyof T]: T[K] extends string ? string : Strings<T[K]> };
export type MouldsStrings = Strings<typeof en>;
