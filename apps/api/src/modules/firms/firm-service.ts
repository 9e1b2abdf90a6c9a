import { ForbiddenError, subject } from '@casl/ability';
import type { FirmSettings, FirmSettingsInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findFirmSettings, updateFirmSettings } from './firm-dal.ts';

export async function getFirmSettings(deps: AppDeps, actor: Actor): Promise<FirmSettings> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', subject('Firm', { firmId: actor.firmId }));
  const firm = await findFirmSettings(deps.db, actor.firmId);
  if (!firm) throw notFound('That firm');
  return firm;
}

export async function saveFirmSettings(deps: AppDeps, actor: Actor, input: FirmSettingsInput): Promise<FirmSettings> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Firm', { firmId: actor.firmId }));
  await updateFirmSettings(deps.db, actor.firmId, input);
  return getFirmSettings(deps, actor);
}
