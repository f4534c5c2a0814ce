'use client';
// Loads the working copy of each placed upload once, for the canvas. An upload
// that was deleted (404) is 'missing' and drawn as an empty frame.
import { useEffect, useRef, useState } from 'react';

export type LoadedImage = HTMLImageElement | 'missing';

export function useLightboxImages(uploadIds: string[]): Map<string, LoadedImage> {
  const [images, setImages] = useState(() => new Map<string, LoadedImage>());
  /** Ids whose load has begun: each image is fetched once however often the list changes. */
  const started = useRef(new Set<string>());
  const wanted = [...new Set(uploadIds)].sort().join(',');
  useEffect(() => {
    for (const id of wanted ? wanted.split(',') : []) {
      if (started.current.has(id)) continue;
      started.current.add(id);
      const img = new window.Image();
      img.onload = () => setImages((m) => new Map(m).set(id, img));
      img.onerror = () => setImages((m) => new Map(m).set(id, 'missing'));
      img.src = `/api/uploads/${id}/working`;
    }
  }, [wanted]);
  return images;
}
