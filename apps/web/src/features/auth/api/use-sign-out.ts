import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient, isApiError } from '@/lib/api-client';
import { endSession } from '@/lib/auth';

export async function signOut(): Promise<void> {
  try {
    await apiClient.send('POST', '/api/auth/sign-out');
  } catch (error) {
    // Already signed out (session expired elsewhere) is the outcome the person asked for.
    if (!isApiError(error, 401)) throw error;
  }
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => endSession(queryClient),
  });
}
