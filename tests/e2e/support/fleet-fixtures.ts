import type {
  CreateKitItemInput,
  CreateVanInput,
  Depot,
  ItemKind,
  Kit,
  KitItem,
  KitLabel,
  Van,
} from '@heatfleet/domain';
import { callApi, type ApiSession } from './api-session';

// Vans, depots and kit for a fixture firm, each through its own route (apps/api/src/modules/locations and kits).

/** The depot every new firm starts with ("Main depot"). */
export async function mainDepot(session: ApiSession): Promise<Depot> {
  const { depots } = await callApi<{ depots: Depot[] }>(session, 'get', '/api/depots');
  return depots[0]!;
}

export async function createVan(session: ApiSession, input: CreateVanInput): Promise<Van> {
  return (await callApi<{ van: Van }>(session, 'post', '/api/vans', { data: input })).van;
}

/** The firm's item kinds, in the order the API lists them (a new firm's defaults: packages/domain default-item-kinds.ts). */
export async function itemKinds(session: ApiSession): Promise<ItemKind[]> {
  return (await callApi<{ itemKinds: ItemKind[] }>(session, 'get', '/api/item-kinds')).itemKinds;
}

export async function itemKindNamed(session: ApiSession, name: string): Promise<ItemKind> {
  const kind = (await itemKinds(session)).find((k) => k.name === name);
  if (!kind) throw new Error(`The firm has no item kind "${name}"`);
  return kind;
}

export async function createKit(session: ApiSession, name: string): Promise<Kit> {
  return (await callApi<{ kit: Kit }>(session, 'post', '/api/kits', { data: { name } })).kit;
}

/** An item, at the firm's depot unless a location is given. */
export async function addKitItem(session: ApiSession, input: CreateKitItemInput): Promise<KitItem> {
  return (await callApi<{ item: KitItem }>(session, 'post', '/api/kit-items', { data: input })).item;
}

/** A vibrating tool's magnitude in m/s², for the HSE points on the job sheet. */
export async function setVibration(session: ApiSession, itemId: number, vibrationMs2: number): Promise<KitItem> {
  return (await callApi<{ item: KitItem }>(session, 'patch', `/api/kit-items/${itemId}`, { data: { vibrationMs2 } }))
    .item;
}

/** The whole kit goes out to a van, logged in custody like any check-out. */
export async function checkOutKit(session: ApiSession, kitId: number, vanId: number): Promise<void> {
  await callApi(session, 'post', `/api/kits/${kitId}/check-out`, {
    data: { toLocationId: vanId },
    status: 200,
    idempotent: true,
  });
}

/** The kit's labels, with the URL each QR code prints. */
export async function kitLabels(session: ApiSession, kitId: number): Promise<KitLabel[]> {
  return (await callApi<{ labels: KitLabel[] }>(session, 'get', `/api/kit-items/labels?kitId=${kitId}`)).labels;
}
