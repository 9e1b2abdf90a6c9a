import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordResetConfirmInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const messageEnvelopeSchema = z.object({ message: z.string() });

export function requestPasswordReset(input: { email: string }) {
  return apiClient.post('/api/auth/password-reset', input, messageEnvelopeSchema);
}

export function confirmPasswordReset(input: PasswordResetConfirmInput) {
  return apiClient.post('/api/auth/password-reset/confirm', input, messageEnvelopeSchema);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
