import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signOut } from './session-api';
import { rememberMe, sessionKeys } from './session-queries';

/** Sign out here; everything cached about the team is dropped with the session. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      rememberMe(null);
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}
