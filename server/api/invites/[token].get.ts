// Public: the token from the mailed link is the proof. Says which studio and role it offers.
export default defineEventHandler(async (event) => {
  return describeInvite(getRouterParam(event, 'token') ?? '')
})
