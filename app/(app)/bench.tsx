import { BenchScreen } from '@/components/bench/bench-screen';

export default function Bench() {
  return <BenchScreen />;
}
