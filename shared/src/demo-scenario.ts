/**
 * The invented demo scenario: Tallowmere Valley Electric Cooperative. Everything here is
 * fiction, used by the demo seeder, the simulator and the browser tests; none of it is real.
 */
import type { Role } from './roles';

export const DEMO_TIME_ZONE = 'America/Denver';

export interface DemoZone {
  code: string;
  name: string;
  character: string;
  /** Typical peak in MW, for the simulator and the plausible range. */
  peakMw: number;
}

export const DEMO_ZONES: readonly DemoZone[] = [
  { code: 'MILLRACE', name: 'Millrace', character: 'old town, residential', peakMw: 260 },
  { code: 'COPPERLINE', name: 'Copperline', character: 'industrial park with a two-shift smelter', peakMw: 340 },
  { code: 'HARROW', name: 'Harrow Flats', character: 'suburban, air-conditioning heavy', peakMw: 300 },
  { code: 'QUARRY', name: 'Quarry Hill', character: 'rural, irrigation pumps in summer', peakMw: 150 },
  { code: 'LANTERN', name: 'Lanternside', character: 'commercial centre', peakMw: 220 },
];

export interface DemoUser {
  email: string;
  name: string;
  role: Role;
  password: string;
}

/** Documented demo logins (README). Change or remove them before any real use. */
export const DEMO_USERS: readonly DemoUser[] = [
  { email: 'pia.lund@tallowmere.example', name: 'Pia Lund', role: 'viewer', password: 'viewer-demo' },
  { email: 'ines.marlow@tallowmere.example', name: 'Ines Marlow', role: 'operator', password: 'operator-demo' },
  { email: 'tomas.reedy@tallowmere.example', name: 'Tomas Reedy', role: 'operator', password: 'operator-demo' },
  { email: 'hal.brennick@tallowmere.example', name: 'Hal Brennick', role: 'supervisor', password: 'supervisor-demo' },
  { email: 'nora.vance@tallowmere.example', name: 'Nora Vance', role: 'supervisor', password: 'supervisor-demo' },
  { email: 'dana.oakes@tallowmere.example', name: 'Dana Oakes', role: 'admin', password: 'admin-demo' },
];
