import http from 'node:http';

/**
 * Plain HTTP requests for what `fetch` will not send: a Host header of our choosing, a source address other than
 * 127.0.0.1 (the whole 127.0.0.0/8 reaches the loopback server), and bodies streamed in chunks.
 */
export interface RawReply {
  status: number;
  headers: http.IncomingHttpHeaders;
  text: string;
}

export interface RawInit {
  method?: string;
  headers?: Record<string, string>;
  body?: string | Buffer;
  /** Source address of the connection, e.g. 127.0.0.2. */
  localAddress?: string;
}

export function rawRequest(url: string, path: string, init: RawInit = {}): Promise<RawReply> {
  const target = new URL(url);
  return new Promise((resolve, reject) => {
    const request = http.request(
      {
        host: target.hostname, port: target.port, path, method: init.method ?? 'GET',
        // Node frames a DELETE body neither by length nor by chunks unless told: give every body its length.
        headers: { ...(init.body !== undefined ? { 'content-length': String(Buffer.byteLength(init.body)) } : {}), ...init.headers },
        ...(init.localAddress ? { localAddress: init.localAddress } : {}), agent: false,
      },
      (response) => {
        let text = '';
        response.setEncoding('utf8');
        response.on('data', (chunk: string) => (text += chunk));
        response.on('end', () => resolve({ status: response.statusCode ?? 0, headers: response.headers, text }));
        response.on('error', reject);
      },
    );
    request.on('error', reject);
    request.end(init.body);
  });
}

export interface StreamedReply {
  status: number;
  headers: http.IncomingHttpHeaders;
  text: string;
  /** Body bytes written before the reply's status line arrived (or the server closed the connection). */
  sentBeforeReply: number;
}

/**
 * Streams up to `totalBytes` of `chunk` repeated, with chunked transfer encoding (no Content-Length), waiting for the
 * socket to drain between chunks, and stops as soon as the server answers or closes.
 */
export function streamBody(url: string, path: string, headers: Record<string, string>, totalBytes: number, chunk: Buffer): Promise<StreamedReply> {
  const target = new URL(url);
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = false;
    let sentBeforeReply = -1;
    const request = http.request({ host: target.hostname, port: target.port, path, method: 'POST', headers, agent: false }, (response) => {
      answered = true;
      sentBeforeReply = sent;
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (c: string) => (text += c));
      response.on('end', () => {
        request.destroy();
        resolve({ status: response.statusCode ?? 0, headers: response.headers, text, sentBeforeReply });
      });
    });
    request.on('error', (error) => {
      if (!answered) reject(new Error(`no reply after ${sent} bytes: ${error.message}`));
    });
    const pump = (): void => {
      while (!answered && sent < totalBytes) {
        sent += chunk.length;
        if (!request.write(chunk)) {
          request.once('drain', pump);
          return;
        }
      }
      if (!answered) request.end();
    };
    pump();
  });
}
