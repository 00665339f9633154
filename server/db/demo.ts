// The demo studio. Every name, dish and price here is invented.
export const demoStudio = {
  name: 'Brackenford Test Kitchen',
  slug: 'brackenford',
  locale: 'en-GB',
  currency: 'GBP',
}
