import type { Capability } from '../../lib/roles';

/** Who may download a stored file: whoever may see the item it belongs to; unknown kinds nobody. */
export function uploadCapability(relatedType: string | null): Capability | null {
  switch (relatedType) {
    case 'spec':
      return 'readSpecs';
    case 'parts-library':
      return 'readParts';
    default:
      return null;
  }
}
