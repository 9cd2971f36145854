import { View } from 'react-native';
import Svg from 'react-native-svg';
import {
  complianceStatusLabels,
  noticeLevelLabels,
  noticeReachLabels,
  type ComplianceCounts,
  type ComplianceStatus,
  type NoticeDetail,
  type NoticeLevel,
  type Role,
} from '@/db/contracts';
import { colors, statusColors } from '@/constants/theme';
import { MarkGlyph, TagFrame, type MarkShape } from '@/components/ui/status-mark';
import { Txt } from '@/components/ui/text';

/**
 * A notice's level and a build's answer each read by shape as well as colour (bad light, colour-vision
 * deficiency), as the hole and finding marks do. Mandatory is the warning triangle of a flagged hole.
 */
const levelShapes: Record<NoticeLevel, MarkShape> = {
  mandatory: 'triangle',
  recommended: 'diamond',
  information: 'open-circle',
};
const levelColors: Record<NoticeLevel, string> = {
  mandatory: colors.error,
  recommended: colors.caution,
  information: colors.accent,
};

/** Not read is the pending hole's open circle; done the accepted hole's ringed tick. */
const statusShapes: Record<ComplianceStatus, MarkShape> = {
  open: 'open-circle',
  acknowledged: 'hourglass',
  done: 'ringed-check',
  not_applicable: 'square',
};
const statusColorsOf: Record<ComplianceStatus, string> = {
  open: colors.warning,
  acknowledged: statusColors.reworked,
  done: statusColors.accepted,
  not_applicable: statusColors.pending,
};

function Tag({ shape, color, words, testID }: { shape: MarkShape; color: string; words: string; testID: string }) {
  return (
    <TagFrame color={color} testID={testID}>
      <View aria-hidden style={{ width: 14, height: 14 }}>
        <Svg width={14} height={14} viewBox="0 0 14 14">
          <MarkGlyph shape={shape} color={color} cx={7} cy={7} r={6} />
        </Svg>
      </View>
      <Txt variant="small" bold>
        {words}
      </Txt>
    </TagFrame>
  );
}

export function NoticeLevelTag({ level }: { level: NoticeLevel }) {
  return (
    <Tag
      shape={levelShapes[level]}
      color={levelColors[level]}
      words={noticeLevelLabels[level]}
      testID={`notice-level-mark-${level}`}
    />
  );
}

export function ComplianceStatusTag({ status }: { status: ComplianceStatus }) {
  return (
    <Tag
      shape={statusShapes[status]}
      color={statusColorsOf[status]}
      words={complianceStatusLabels[status]}
      testID={`compliance-status-${status}`}
    />
  );
}

/**
 * Where a notice opens: in the supplier's catalogue (beside the kit it was issued for), and under builds
 * for the builders and inspectors (a notice is a message to their build). Either page serves anyone.
 */
export const noticeHref = (id: string, role: Role | null | undefined) =>
  role === 'supplier' ? (`/catalogue/notices/${id}` as const) : (`/builds/notices/${id}` as const);

/** "N° 12": a notice's number, as the supplier's list and the builder's banner both say it. */
export const noticeNumber = (n: number) => `N° ${n}`;

/** "3 of 5 builds done · 1 does not apply · 1 not yet read": what the counts say, most telling first. */
export function countsWords(c: ComplianceCounts): string {
  if (!c.builds) return 'No shipped build is reached.';
  const parts = [`${c.done} of ${c.builds} build${c.builds === 1 ? '' : 's'} done`];
  if (c.not_applicable) parts.push(`${c.not_applicable} ${c.not_applicable === 1 ? 'does' : 'do'} not apply`);
  if (c.acknowledged) parts.push(`${c.acknowledged} read, not yet done`);
  if (c.open) parts.push(`${c.open} not yet read`);
  return parts.join(' · ');
}

/** The effectivity in plain words, one line each: which kits, which parts, which of them. */
export function effectivityWords(e: NoticeDetail['effectivity'], kitName: string): string[] {
  const kits =
    e.serialFrom && e.serialTo
      ? `${kitName}, kit serials ${e.serialFrom} to ${e.serialTo}`
      : `${kitName}, every kit serial`;
  const parts = e.parts.length
    ? `Parts: ${e.parts
        .map(
          (p) =>
            `${p.partNumber} ${p.name} (${p.letters.length ? `revision${p.letters.length === 1 ? '' : 's'} ${p.letters.join(', ')}` : 'every revision'})`,
        )
        .join('; ')}`
    : 'The kit as a whole, no part named';
  return [kits, parts, `Reaches: ${noticeReachLabels[e.reaches].toLowerCase()}`];
}

/**
 * A notice about parts of the airframe (any part design named, or a mandatory one) is structural work: the
 * product's safety words, said for a notice.
 */
export const noticeCaution =
  'This notice is about the aircraft’s structure. The supplier’s approved data, the applicable airworthiness rules ' +
  'and your local authority govern the work. Recording it here is a record, not approval or certification.';

export const isStructural = (n: Pick<NoticeDetail, 'level' | 'effectivity'>) =>
  n.level === 'mandatory' || n.effectivity.parts.length > 0;
