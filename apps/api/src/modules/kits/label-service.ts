import QRCode from 'qrcode';
import type { KitLabel } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { ruleBroken } from '../../lib/http-error.ts';
import { loadItems } from './kit-item-service.ts';

/** Label data for an A4 sheet: each QR code opens the item's page in the app. */
export async function buildLabels(
  deps: AppDeps,
  actor: Actor,
  query: { ids?: number[]; kitId?: number },
): Promise<KitLabel[]> {
  if (!query.ids && query.kitId === undefined) throw ruleBroken('Say which labels to print: ids=1,2,3 or kitId=N.');
  const items = await loadItems(deps.db, actor.firmId, deps.clock.now(), { ids: query.ids, kitId: query.kitId });
  return Promise.all(
    items.map(async (item) => {
      const url = new URL(`/kit-items/${item.id}`, deps.env.APP_ORIGIN).toString();
      // Error correction M survives a scuffed label; the margin is the quiet zone scanners need.
      const svg = await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 });
      return {
        itemId: item.id,
        assetTag: item.assetTag,
        kindName: item.kind.name,
        kitName: item.kit?.name ?? null,
        url,
        qrSvgDataUrl: `data:image/svg+xml;base64,${Buffer.from(svg).toString('base64')}`,
      };
    }),
  );
}
