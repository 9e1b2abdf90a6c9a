/** The people the API's seed creates (invented firms on the reserved .example domain). */
export const demoPassword = 'heatfleet-demo-2026';

export const demoAccounts: { email: string; role: string }[] = [
  { email: 'owner@brackenford.example', role: 'Owner, Brackenford Heating Co.' },
  { email: 'admin@brackenford.example', role: 'Admin, Brackenford Heating Co.' },
  { email: 'stores@brackenford.example', role: 'Stores, Brackenford Heating Co.' },
  { email: 'engineer@brackenford.example', role: 'Engineer, Brackenford Heating Co.' },
  { email: 'owner@tarnside.example', role: 'Owner, Tarnside Plumbing (the second firm)' },
  { email: 'multi@heatfleet.example', role: 'Engineer in both firms (shows the firm switcher)' },
];
