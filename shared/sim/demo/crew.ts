/**
 * The demo crew: a small club-and-filming team. Every name is invented; addresses use the
 * reserved example.com domain (RFC 2606), so no mail can reach a real person.
 */
export type DemoRole = 'owner' | 'tuner' | 'pilot' | 'coach' | 'viewer';

export interface DemoMember {
  /** Stable handle the rest of the demo data refers to. */
  key: string;
  name: string;
  email: string;
  role: DemoRole;
  /** One line for the member list. */
  about: string;
}

export const demoTeam = {
  name: 'Tern Field Flyers',
  slug: 'tern-field-flyers',
  about:
    'A weekend club that also flies small filming and survey jobs: one freestyle quad, one camera ship and one hexacopter rig.',
} as const;

/** The password the demo loader gives every demo account; the sign-in page can show it. */
export const DEMO_PASSWORD = 'tern-field-demo';

export const demoMembers: DemoMember[] = [
  {
    key: 'maren',
    name: 'Maren Oduya',
    email: 'maren.oduya@example.com',
    role: 'owner',
    about: 'Runs the club and does the tuning and repairs on the bench.',
  },
  {
    key: 'tobin',
    name: 'Tobin Harkness',
    email: 'tobin.harkness@example.com',
    role: 'pilot',
    about: 'Freestyle pilot; flies Kite most weekends.',
  },
  {
    key: 'sol',
    name: 'Sol Andreescu',
    email: 'sol.andreescu@example.com',
    role: 'pilot',
    about: 'Camera and survey pilot; flies Heron and Osprey on jobs.',
  },
  {
    key: 'wren',
    name: 'Wren Takahara-Bell',
    email: 'wren.takahara-bell@example.com',
    role: 'coach',
    about: 'Reviews flights and keeps an eye on wear between sessions.',
  },
  {
    key: 'ada',
    name: 'Ada Mulvaney',
    email: 'ada.mulvaney@example.com',
    role: 'viewer',
    about: 'Client contact for the survey work; reads the verdicts.',
  },
];
