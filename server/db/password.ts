// The same scrypt hasher nuxt-auth-utils uses (its `hashPassword` is @adonisjs/hash's Scrypt, given
// SCRYPT_OPTIONS through nuxt.config.ts), for code outside Nitro: the seeder run by the command-line scripts.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { SCRYPT_OPTIONS } from './scrypt-cost'

const hasher = new Hash(new Scrypt({ ...SCRYPT_OPTIONS }))

export function hashPasswordOutsideNitro(password: string): Promise<string> {
  return hasher.make(password)
}
