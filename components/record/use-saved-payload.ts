'use client';

import { useState } from 'react';

/**
 * Remembers the `payload` field of the last successful save, so Save stays disabled (and says
 * "Saved") until something in the form changes; a second click would store the same run again.
 */
export function useSavedPayload() {
  const [saved, setSaved] = useState<string | null>(null);
  return {
    isSaved: (payload: string) => saved === payload,
    markSaved: (formData: FormData) => setSaved(String(formData.get('payload'))),
  };
}
