// Public: what the trust page shows before anyone signs in (a device must trust the laptop first).
// Whether a studio root is there to install, and its fingerprint to compare on the device.
export default defineEventHandler(async () => {
  const root = await studioRoot()
  return { root: root ? { fingerprint: root.fingerprint, file: '/api/trust/root' } : null }
})
