/** How a phone on the shop's network reaches Pitchcard: what the admin's and supplier's setup page shows. */
export type PhoneSetup = {
  publicUrl: string;
  /** A loopback address works on this machine only: labels and mail links would not open on a phone. */
  loopback: boolean;
  https: boolean;
  /** The address as a QR code for a phone's camera (a data: URL). */
  qrDataUrl: string;
  /** The certificate a phone must trust when Pitchcard made its own; null when it serves plain HTTP. */
  certificate: { fingerprint: string; downloadUrl: string; madeHere: boolean; names: string[] } | null;
};
