// The same scrypt hasher nuxt-auth-utils uses (its `hashPassword` is @adonisjs/hash's Scrypt with
// default options), for code outside Nitro: the seeder run by the command-line scripts.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'

const hasher = new Hash(new Scrypt({}))

export function hashPasswordOutsideNitro(password: string): Promise<string> {
  return hasher.make(password)
}
