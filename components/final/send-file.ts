'use client';
// Sends one file as multipart (field "file") with upload progress (XHR), answering the server's JSON or its error message.
export function sendFile<T>(url: string, file: File, onProgress: (fraction: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let body: { error?: string } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as T);
      else reject(new Error(body.error ?? `Upload failed (${xhr.status}).`));
    };
    xhr.onerror = () => reject(new Error('The connection was lost during the upload.'));
    const form = new FormData();
    form.append('file', file);
    xhr.send(form);
  });
}
