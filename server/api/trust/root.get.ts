import { DomainError } from '../../../shared/utils/domain-error'
// Public: the studio's root certificate as a file a phone or tablet offers to install
// (application/x-x509-ca-cert, the type Android and iOS open as a certificate; RFC 5280 DER would do
// too, PEM is what both accept from a browser download).
export default defineEventHandler(async (event) => {
  const root = await studioRoot()
  if (!root) {
    throw new DomainError('not-found', 'This server has no studio certificate to install: it runs on plain http, or on a certificate the studio already trusts.')
  }
  setResponseHeader(event, 'Content-Type', 'application/x-x509-ca-cert')
  setResponseHeader(event, 'Content-Disposition', 'attachment; filename="hobline-root-ca.crt"')
  setResponseHeader(event, 'Cache-Control', 'no-store')
  return root.pem
})
