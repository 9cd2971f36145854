import { useLocalSearchParams } from 'expo-router';
import { NoticeScreen } from '@/components/notices/notice-screen';
import { oneParam } from '@/components/navigation/param';

export default function Notice() {
  const params = useLocalSearchParams<{ noticeId: string }>();
  return <NoticeScreen noticeId={oneParam(params.noticeId)} />;
}
