export { startPayfake, type Payfake, type PayfakeOptions } from './server.ts';
export { signatureHeader } from './webhooks.ts';
export { PLATFORM, type StripeEvent } from './state.ts';
