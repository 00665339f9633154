// npm run tls — make (or keep) the studio's certificate authority and this laptop's server
// certificate in .data/tls/ (NUXT_TLS_DIR), then print the settings that serve the built app over
// https with them. `npm run demo -- --https` does the same by itself. Extra names for the
// certificate: HOBLINE_TLS_HOSTS=studio-laptop.lan,10.0.0.5
import { readFileSync } from 'node:fs'
import { certificateFingerprint, lanAddress, lanHostNames } from '../server/tls/local-ca'
import { localTls } from './tls-setup'

const tls = localTls()
const port = process.env.PORT || '3000'
console.log(`Studio root certificate: ${tls.rootCert}${tls.madeRoot ? ' (new: every device trusts it once)' : ' (kept)'}`)
console.log(`Its SHA-256 fingerprint, to compare on each device: ${certificateFingerprint(readFileSync(tls.rootCert, 'utf8'))}`)
console.log(`Server certificate: ${tls.cert} for ${lanHostNames(tls.extraHosts).join(', ')}${tls.madeServer ? ' (new)' : ' (kept)'}`)
console.log('\nServe the built app over https with:')
console.log(`  NITRO_SSL_CERT="$(cat ${tls.cert})" NITRO_SSL_KEY="$(cat ${tls.key})" \\`)
console.log(`  NUXT_TLS_ROOT_CERT_PATH=${tls.rootCert} NUXT_PUBLIC_SITE_URL=https://${lanAddress() ?? 'localhost'}:${port} npm start`)
