import { useMutation } from '@tanstack/react-query';
import { messageResponseSchema, type PasswordResetConfirmInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export function requestPasswordReset(input: { email: string }) {
  return apiClient.post('/api/auth/password-reset', input, messageResponseSchema);
}

export function confirmPasswordReset(input: PasswordResetConfirmInput) {
  return apiClient.post('/api/auth/password-reset/confirm', input, messageResponseSchema);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
