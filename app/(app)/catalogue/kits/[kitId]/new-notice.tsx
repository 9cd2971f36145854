import { useLocalSearchParams } from 'expo-router';
import { NoticeFormScreen } from '@/components/notices/notice-form-screen';
import { oneParam } from '@/components/navigation/param';

export default function NewNotice() {
  const params = useLocalSearchParams<{ kitId: string }>();
  return <NoticeFormScreen kitId={oneParam(params.kitId)} />;
}
