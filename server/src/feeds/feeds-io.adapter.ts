import { IoAdapter } from '@nestjs/platform-socket.io';
import { MAX_BATCH_BYTES } from '@morrowline/shared';
import type { Server, ServerOptions } from 'socket.io';

/**
 * The application's socket.io adapter. Every gateway shares one socket.io server, created with the
 * options of whichever gateway starts first, so a per-gateway maxHttpBufferSize is not reliably
 * applied (the feeds' 8 MB request was silently 1 MB). Here the server is always created with
 * the documented MAX_BATCH_BYTES, which engine.io also hands to the WebSocket as its maxPayload.
 */
export class FeedsIoAdapter extends IoAdapter {
  override createIOServer(port: number, options?: ServerOptions): Server {
    return super.createIOServer(port, { ...options, maxHttpBufferSize: MAX_BATCH_BYTES }) as Server;
  }
}
