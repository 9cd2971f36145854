import { Image, StyleSheet, View } from 'react-native';
import type { PhoneSetup } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { usePhoneSetupQuery } from '@/hooks/queries/network';

/** For the admin or supplier setting up the shop's phones: the address as a QR code, and how a phone trusts it. */
export function PhoneSetupScreen() {
  const q = usePhoneSetupQuery();
  return (
    <Screen
      title="Phones at the bench"
      subtitle="How a phone on the shop's network opens Pitchcard"
      account
      testID="phone-setup-screen"
    >
      {q.isPending ? <LoadingState what="Reading this machine's address" /> : null}
      {q.isError ? <ErrorState error={q.error} onRetry={() => void q.refetch()} /> : null}
      {q.data ? <Setup s={q.data} /> : null}
    </Screen>
  );
}

function Setup({ s }: { s: PhoneSetup }) {
  if (s.loopback) {
    return (
      <Notice tone="caution" testID="phone-setup-loopback">
        <Txt bold>Phones cannot reach this address.</Txt>
        <Txt>
          Pitchcard answers at <Mono>{s.publicUrl}</Mono>, which only this machine can open. Labels cannot be printed
          and mail links will not open on a phone until it runs in network mode.
        </Txt>
        <Txt>
          Stop it and start it again with <Mono>npm start -- --lan</Mono>, or set <Mono>PUBLIC_URL</Mono> to the address
          the shop’s phones reach this machine by.
        </Txt>
      </Notice>
    );
  }
  return (
    <View style={{ gap: space.lg }}>
      <Section title="1. Open this address on the phone">
        <View style={styles.row}>
          <Image
            source={{ uri: s.qrDataUrl }}
            style={styles.qr}
            accessibilityLabel={`QR code of ${s.publicUrl}`}
            testID="phone-setup-qr"
          />
          <View style={{ flex: 1, minWidth: 200, gap: space.sm }}>
            <KeyValue label="Address">
              <Mono bold testID="phone-setup-url">
                {s.publicUrl}
              </Mono>
            </KeyValue>
            <Txt>
              Point the phone’s camera at the code, or type the address into its browser. The phone must be on the same
              network as this machine.
            </Txt>
          </View>
        </View>
      </Section>
      {s.certificate ? (
        <Section title="2. Let the phone trust this machine">
          <Txt>
            Pitchcard made its own certificate, so the phone’s browser first warns that the connection is not private. A
            phone that trusts the certificate opens the camera and works without the warning.
          </Txt>
          <Button
            label="Download the certificate"
            variant="secondary"
            onPress={() => openCertificate(s.certificate!.downloadUrl)}
            testID="phone-setup-certificate"
          />
          <Txt variant="small">
            On the phone: open the downloaded file and install it as a trusted certificate (on most phones under the
            security settings, “install a certificate”), then check that its fingerprint matches the one below.
          </Txt>
          <KeyValue label="Fingerprint (SHA-256)">
            <Mono variant="small" testID="phone-setup-fingerprint" style={styles.wrap}>
              {s.certificate.fingerprint}
            </Mono>
          </KeyValue>
          <KeyValue label="Made for">
            <Mono variant="small">{s.certificate.names.join(', ')}</Mono>
          </KeyValue>
        </Section>
      ) : null}
      <Section title={s.certificate ? '3. Add it to the home screen' : '2. Add it to the home screen'}>
        <Txt>
          In the phone’s browser menu, choose “Add to home screen” or “Install”. Pitchcard then opens like an app and
          keeps the parts in progress for work without signal.
        </Txt>
      </Section>
    </View>
  );
}

function openCertificate(url: string) {
  if (typeof window !== 'undefined') window.location.assign(url);
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, alignItems: 'flex-start' },
  qr: { width: 200, height: 200, borderWidth: hairline, borderColor: colors.ink, backgroundColor: '#fff' },
  wrap: { flexShrink: 1 },
});
