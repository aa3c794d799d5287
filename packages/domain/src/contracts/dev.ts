/** `GET /api/dev/mail`: what the development mail sink received (only where the API runs one). */

export interface SinkMessage {
  id: number;
  /** ISO 8601. */
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface DevMailAnswer {
  /** The sink's SMTP port; null when this API runs none. */
  port: number | null;
  items: SinkMessage[];
}
