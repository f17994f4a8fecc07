/** The parts-library version a stored comparison was computed with ("7"), or null. Both sides. */
export function storedLibraryVersion(comparison: Record<string, unknown> | null | undefined): string | null {
  const library = comparison?.partsLibrary as { version?: unknown } | undefined;
  return typeof library?.version === 'string' ? library.version : null;
}
