import QRCode from "qrcode";
import { useEffect, useState } from "react";

/**
 * A QR code as an <img> (PNG data URL): no canvas script at print time and nothing inline that
 * the page's content-security policy would refuse.
 */
export function QrImage({ value, alt, size = 160, className }: { value: string; alt: string; size?: number; className?: string }) {
  const [src, setSrc] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    QRCode.toDataURL(value, { errorCorrectionLevel: "M", margin: 1, width: size * 2, color: { dark: "#000000", light: "#ffffff" } })
      .then((url) => live && setSrc(url))
      .catch((e: unknown) => live && setError(e instanceof Error ? e.message : "cannot draw the code"));
    return () => {
      live = false;
    };
  }, [value, size]);
  if (error) return <p className="text-xs text-limit">QR code unavailable ({error}); use the address below.</p>;
  if (!src) return <div style={{ width: size, height: size }} className="animate-pulse bg-rule/40" aria-hidden />;
  return <img src={src} alt={alt} width={size} height={size} className={className} />;
}
