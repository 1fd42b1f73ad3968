export function Avatar({ userId, avatarKey, name, size = 64 }: { userId: string; avatarKey: string | null; name: string; size?: number }) {
  if (!avatarKey) {
    return (
      <span
        aria-hidden="true"
        style={{ width: size, height: size }}
        className="inline-flex items-center justify-center rounded-full bg-verdigris-wash font-serif text-xl text-verdigris-deep"
      >
        {name.slice(0, 1).toUpperCase()}
      </span>
    );
  }
  // The key is part of the URL so a new picture is never hidden behind a cached old one.
  const version = avatarKey.split("/").pop()?.replace(".webp", "") ?? "";
  return <img src={`/api/avatars/${userId}?v=${version}`} alt={`${name}'s picture`} width={size} height={size} className="rounded-full" />;
}
