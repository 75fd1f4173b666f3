import { StyleSheet } from '@react-pdf/renderer';
import { REPORT_FONT } from './fonts';

export const INK = '#101317';
export const MUTED = '#4a525c';
export const RULE = '#c9ced4';
export const ACCENT = '#b35c00';

export const styles = StyleSheet.create({
  page: { fontFamily: REPORT_FONT, fontSize: 9, color: INK, padding: 36, lineHeight: 1.35 },
  title: { fontSize: 16, fontWeight: 700, marginBottom: 4, lineHeight: 1.2 },
  subtitle: { fontSize: 10, color: MUTED, marginBottom: 10 },
  h2: { fontSize: 12, fontWeight: 700, marginTop: 12, marginBottom: 4 },
  h3: { fontSize: 10, fontWeight: 700, marginTop: 6, marginBottom: 2 },
  row: { flexDirection: 'row', gap: 12 },
  col: { flexGrow: 1, flexBasis: 0 },
  label: { color: MUTED },
  bold: { fontWeight: 700 },
  box: { borderWidth: 1, borderColor: RULE, borderRadius: 3, padding: 8, marginTop: 6 },
  caution: { borderLeftWidth: 3, borderLeftColor: ACCENT, paddingLeft: 6, marginTop: 3 },
  table: { borderTopWidth: 1, borderTopColor: RULE, marginTop: 4 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: RULE, paddingVertical: 2 },
  td: { flexGrow: 1, flexBasis: 0, paddingRight: 4 },
  photo: { width: 150, height: 112, objectFit: 'cover', marginRight: 6, marginBottom: 2 },
  footerLeft: { position: 'absolute', bottom: 18, left: 36, fontSize: 7, color: MUTED },
});
