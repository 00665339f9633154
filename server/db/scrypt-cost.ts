// The cost of every password hash: OWASP Password Storage Cheat Sheet, scrypt "N=2^17 (128 MiB),
// r=8 (1024 bytes), p=1". In @adonisjs/hash's Scrypt terms (the hasher nuxt-auth-utils uses):
// cost = N, blockSize = r, parallelization = p. One hash needs 128 × N × r bytes = 128 MiB, above
// Node's default scrypt memory ceiling (32 MiB), so maxMemory is raised to twice that; libuv's four
// worker threads bound how many run at once. A hash made at another cost is made again at this one
// on the next successful sign-in (rehashIfOld in server/utils/accounts.ts).
export const SCRYPT_OPTIONS = {
  cost: 2 ** 17,
  blockSize: 8,
  parallelization: 1,
  maxMemory: 2 * 128 * 2 ** 17 * 8,
} as const
