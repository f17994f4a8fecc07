import { useStore } from '@nanostores/react';
import SafetyCautionText from '../../components/SafetyCautionText';
import { $evaluation } from '../../stores/evaluation';
import { isHazardous } from '../../lib/safety';
import { ensureLoaded } from './init';


export default function LiveSafetyCaution() {
  ensureLoaded();
  const { comparison } = useStore($evaluation);
  if (!comparison || !isHazardous(comparison.input.vinMaxV)) return null;
  return <SafetyCautionText />;
}
