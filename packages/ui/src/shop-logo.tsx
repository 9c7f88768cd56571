import { useState } from 'react';

/**
 * The shop's logo as the API serves it (`GET /api/settings/logo`, a PNG, public); nothing at all while the shop has
 * none (the API answers 404). `version` changes the address so a new logo shows at once.
 */
export function ShopLogo({ className, version }: { className?: string; version?: string }) {
  const [missing, setMissing] = useState(false);
  if (missing) return null;
  return (
    <img
      src={version ? `/api/settings/logo?at=${encodeURIComponent(version)}` : '/api/settings/logo'}
      alt=""
      className={className}
      onError={() => setMissing(true)}
    />
  );
}
