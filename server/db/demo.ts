// The demo studio and its crew. Every name, address and password here is invented; the addresses
// use the reserved .test domain, so no mail to them can reach anyone.
import type { StudioRole } from '../../shared/utils/roles'

export const demoStudio = {
  name: 'Brackenford Test Kitchen',
  slug: 'brackenford',
  locale: 'en-GB',
  currency: 'GBP',
  timeZone: 'Europe/London',
  // £1.50 a serving: the budget a weeknight cooking channel might quote (invented).
  budgetPerServingMinor: 150,
}

export const DEMO_PASSWORD = 'hob-demo-2026'

export const demoCrew: { name: string; email: string; role: StudioRole }[] = [
  { name: 'Ines Carrowby', email: 'producer@brackenford.test', role: 'producer' },
  { name: 'Tobiah Quill', email: 'host@brackenford.test', role: 'host' },
  { name: 'Wren Adeyemi-Holt', email: 'camera@brackenford.test', role: 'camera' },
  { name: 'Saoirse Lindqvist', email: 'viewer@brackenford.test', role: 'viewer' },
]
