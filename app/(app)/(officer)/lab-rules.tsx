import { LabRulesScreen } from '@/components/lab-rules/lab-rules-screen';

export default function LabRulesRoute() {
  return <LabRulesScreen />;
}
