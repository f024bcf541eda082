import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { photoFieldsSchema, photoLimits } from '@shared/schemas/publishing';
import { apiGet, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { uploadWithProgress } from '@/lib/upload-with-progress';

export { photoFieldsSchema, photoLimits };

/** A photo of a result as the server lists it. */
export interface Photo {
  id: number;
  resultId: number;
  url: string;
  thumbUrl: string;
  alt: string;
  width: number;
  height: number;
  bytes: number;
  createdAt: string;
}

/** GET /api/results/:id/photos: the photos, the most allowed, and whether the viewer may add one. */
export function getPhotos(resultId: number, signal?: AbortSignal) {
  return apiGet<{ items: Photo[]; max: number; canAdd: boolean }>(`/api/results/${resultId}/photos`, {}, signal);
}

export const photosQueryOptions = (resultId: number) =>
  queryOptions({ queryKey: queryKeys.photos(resultId), queryFn: ({ signal }) => getPhotos(resultId, signal) });

/** A result's photos, as a query. */
export function usePhotos(resultId: number) {
  return useQuery(photosQueryOptions(resultId));
}

/** POST /api/results/:id/photos (multipart `photo`, `alt`), reporting upload progress (0–1). */
export function uploadPhoto(resultId: number, file: File, alt: string, onProgress?: (sent: number) => void): Promise<Photo> {
  const form = new FormData();
  form.append('alt', alt);
  form.append('photo', file);
  return uploadWithProgress<Photo>(`/api/results/${resultId}/photos`, form, onProgress);
}

/** Uploads a photo and refreshes the result's list. */
export function useUploadPhoto(resultId: number, onProgress?: (sent: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, alt }: { file: File; alt: string }) => uploadPhoto(resultId, file, alt, onProgress),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.photos(resultId) }),
  });
}

/** DELETE /api/photos/:id (the author): hides the photo. */
export function useRemovePhoto(resultId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: number) => apiRequest<void>(`/api/photos/${photoId}`, { method: 'DELETE' }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.photos(resultId) }),
  });
}
