import type { Role } from './vocabulary';

// Who may use what: named groups so routes and navigation say the same thing.
export const ALL_ROLES: readonly Role[] = ['operator', 'supervisor', 'planner', 'manager', 'sales', 'admin'];
export const OFFICE: readonly Role[] = ['supervisor', 'planner', 'manager', 'sales', 'admin'];
export const FLOOR_LEADS: readonly Role[] = ['supervisor', 'planner', 'manager', 'admin'];
export const PLANNING: readonly Role[] = ['planner', 'manager', 'admin'];
export const REPORT_READERS: readonly Role[] = ['manager', 'planner', 'admin'];
export const ADMIN_ONLY: readonly Role[] = ['admin'];

export function mayUse(role: Role | null | undefined, allowed: readonly Role[]): boolean {
  return !!role && allowed.includes(role);
}

// Packing, dispatch and the customer side.
export const SHIPPING: readonly Role[] = ['planner', 'supervisor', 'sales', 'admin'];
export const SALES_VIEW: readonly Role[] = ['sales', 'manager', 'planner', 'admin'];
export const SHARE_LINKS: readonly Role[] = ['sales', 'planner', 'admin'];

/** Record a payment or a proof approval given by e-mail or phone: the office that talks to the customer. */
export const GATE_RECORDERS: readonly Role[] = ['planner', 'manager', 'sales', 'admin'];

/** Who writes quotes. */
export const QUOTING: readonly Role[] = ['sales', 'planner', 'admin'];

/** Ask "when would it ship?" for an order not taken yet. */
export const WHAT_IF: readonly Role[] = ['planner', 'sales', 'manager'];

/** Quoted against actual: what orders cost to make. */
export const COSTING_READERS: readonly Role[] = ['manager', 'admin'];
