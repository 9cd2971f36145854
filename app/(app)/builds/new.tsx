import { ShipBuildScreen } from '@/components/builds/ship-build-screen';

export default function NewBuild() {
  return <ShipBuildScreen />;
}
