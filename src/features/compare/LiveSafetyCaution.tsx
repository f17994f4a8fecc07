import { useStore } from '@nanostores/react';
import SafetyCautionText from '../../components/SafetyCautionText';
import { $evaluation } from '../../stores/evaluation';
import { ensureLoaded } from './init';

/** Safety extra-low voltage ends at 60 V dc; above it the caution shows. */
export const SELV_LIMIT_V = 60;

export default function LiveSafetyCaution() {
  ensureLoaded();
  const { comparison } = useStore($evaluation);
  if (!comparison || comparison.input.vinMaxV <= SELV_LIMIT_V) return null;
  return <SafetyCautionText />;
}
