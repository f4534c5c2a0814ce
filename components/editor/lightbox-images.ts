'use client';
// Loads the working copy of each placed upload once, for the canvas. An upload
// that was deleted (404) is 'missing' and drawn as an empty frame.
import { useEffect, useState } from 'react';

export type LoadedImage = HTMLImageElement | 'missing';

export function useLightboxImages(uploadIds: string[]): Map<string, LoadedImage> {
  const [images, setImages] = useState(() => new Map<string, LoadedImage>());
  const wanted = [...new Set(uploadIds)].sort().join(',');
  useEffect(() => {
    for (const id of wanted ? wanted.split(',') : []) {
      if (images.has(id)) continue;
      const img = new window.Image();
      img.onload = () => setImages((m) => new Map(m).set(id, img));
      img.onerror = () => setImages((m) => new Map(m).set(id, 'missing'));
      img.src = `/api/uploads/${id}/working`;
    }
    // Only a new set of ids starts loads; finished loads update `images` themselves.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [wanted]);
  return images;
}
