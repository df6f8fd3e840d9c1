import { describe, expect, it } from 'vitest';
import { actionReasons, orderMatchesSearch, travellerOfSearch } from './order-search';

const order = { number: '1066', customer: 'Brindle & Oake Surveyors', title: 'Theodolite pin', process: 'hard_enamel', trays: 5 };

describe('order search', () => {
  it('finds an order by one of its tray or mould numbers (numbers written as trays.ts writes them)', () => {
    expect(orderMatchesSearch(order, '1066-03')).toBe(true);
    expect(orderMatchesSearch(order, '1066-05')).toBe(true);
    expect(orderMatchesSearch(order, '1066-03.1')).toBe(true);
    expect(orderMatchesSearch(order, '1066-mf')).toBe(true);
    // a tray the order does not have, or another order's tray
    expect(orderMatchesSearch(order, '1066-06')).toBe(false);
    expect(orderMatchesSearch(order, '1067-03')).toBe(false);
  });

  it('finds by number, customer, title and the process as shown', () => {
    expect(orderMatchesSearch(order, '106')).toBe(true);
    expect(orderMatchesSearch(order, 'oake')).toBe(true);
    expect(orderMatchesSearch(order, 'THEODOLITE')).toBe(true);
    expect(orderMatchesSearch(order, '硬珐琅', '硬珐琅')).toBe(true);
    expect(orderMatchesSearch(order, 'coin')).toBe(false);
    expect(orderMatchesSearch(order, '  ')).toBe(true);
  });

  it('reads a traveller number out of a search', () => {
    expect(travellerOfSearch('1066-03')).toEqual({ order: '1066', traveller: '1066-03', tray: 3 });
    expect(travellerOfSearch('1066')).toBeNull();
    expect(travellerOfSearch('Club 2024-25')).toBeNull();
  });
});

describe('what waits for the planner', () => {
  const base = { status: 'in_production' as const, openGates: [], late: false };
  it('open gates, ready to release, late risk and holds; nothing for shipped or cancelled orders', () => {
    expect(actionReasons({ ...base, status: 'awaiting_payment', openGates: ['payment_missing'] })).toEqual(['gates']);
    expect(actionReasons({ ...base, status: 'draft' })).toEqual(['release']);
    expect(actionReasons({ ...base, late: true })).toEqual(['late']);
    expect(actionReasons({ ...base, status: 'on_hold' })).toEqual(['hold']);
    expect(actionReasons(base)).toEqual([]);
    expect(actionReasons({ ...base, status: 'shipped', late: true })).toEqual([]);
    expect(actionReasons({ ...base, status: 'cancelled', openGates: ['payment_missing'] })).toEqual([]);
  });
});
