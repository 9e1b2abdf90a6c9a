import { useMemo, type ReactNode } from 'react';
import { AbilityProvider, Can as CaslCan, useAbility as useCaslAbility, type CanProps } from '@casl/react';
import { defineAbilityFor, type AppAbility, type Me } from '@heatfleet/domain';

/** The same rule set the API enforces; here it only decides what to show. */
export function MemberAbilityProvider({ me, children }: { me: Me; children: ReactNode }) {
  const ability = useMemo(
    () => defineAbilityFor({ userId: me.user.id, firmId: me.activeFirm.id, role: me.role, memberId: me.memberId }),
    [me.user.id, me.activeFirm.id, me.role, me.memberId],
  );
  return <AbilityProvider value={ability}>{children}</AbilityProvider>;
}

export function useAbility(): AppAbility {
  return useCaslAbility<AppAbility>();
}

export function Can(props: CanProps<AppAbility>) {
  return <CaslCan<AppAbility> {...props} />;
}
