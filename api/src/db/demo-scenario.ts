import type { Role } from '../../../shared/schemas/session.js';

/**
 * The demo scenario (invented for development; never used as expected values in tests): a harbour automation
 * team studying three mechanisms, and a vineyard robotics team whose work the first team must not see.
 */
export interface DemoTeam {
  name: string;
  projects: { name: string; description: string }[];
}

export interface DemoAccount {
  email: string;
  name: string;
  role: Role;
  team: string;
  /** Development-only password, printed at start; demo data is never seeded in production. */
  password: string;
}

export const demoTeams: DemoTeam[] = [
  {
    name: 'Harrow Dockside Automation',
    projects: [
      {
        name: 'Quay crane trolley',
        description: 'Trolley on an 18 m rail carrying a spreader on 11 m of rope; encoders on trolley travel and rope sway angle.',
      },
      {
        name: 'Two-link inspection arm',
        description: 'Planar arm with 0.62 m and 0.47 m links for hull weld inspection; shoulder and elbow encoders at 400 Hz.',
      },
      {
        name: 'Balance beam test rig',
        description: 'Pivoted 1.3 m beam with a sliding 2.4 kg carriage, used to check controller gains before deployment.',
      },
    ],
  },
  {
    name: 'Kestrel Vineyard Robotics',
    projects: [
      {
        name: 'Trellis pruning gantry',
        description: 'Gantry straddling a vine row; the cutter head hangs on a short pendulum link.',
      },
      {
        name: 'Row-following cart',
        description: 'Two-wheeled cart with a passive trailer, recorded on a sloped headland.',
      },
    ],
  },
];

export const demoAccounts: DemoAccount[] = [
  { email: 'admin@harrow-dockside.example', name: 'Ines Calloway', role: 'admin', team: 'Harrow Dockside Automation', password: 'demo-admin-quayside' },
  { email: 'analyst@harrow-dockside.example', name: 'Tobias Wren', role: 'analyst', team: 'Harrow Dockside Automation', password: 'demo-analyst-trolley' },
  { email: 'viewer@harrow-dockside.example', name: 'Mirela Sandoval', role: 'viewer', team: 'Harrow Dockside Automation', password: 'demo-viewer-bollard' },
  { email: 'analyst@kestrel-vineyard.example', name: 'Oren Hallett', role: 'analyst', team: 'Kestrel Vineyard Robotics', password: 'demo-analyst-trellis' },
];
