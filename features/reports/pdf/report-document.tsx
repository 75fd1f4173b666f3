import { Document, Page, Text, View } from '@react-pdf/renderer';
import type { ReportView } from '../view-model';
import { styles } from './styles';
import { WheelSection, type PhotoImage } from './wheel-section';

export function ReportDocument({
  view,
  images,
}: {
  view: ReportView;
  images: Record<string, PhotoImage | null>;
}) {
  const title = `Job ${view.jobNumber} completion report`;
  const footer = (
    <Text style={styles.footerLeft} fixed>
      {view.shop.name} · Job {view.jobNumber} · {view.customer}
    </Text>
  );
  const [first, ...rest] = view.wheels;
  return (
    <Document title={title} author={view.shop.name} creator="Ringpass" producer="Ringpass">
      <Page size="LETTER" style={styles.page}>
        {footer}
        <ReportHeader view={view} title={title} />
        {first ? <WheelSection wheel={first} images={images} /> : null}
        {rest.length ? null : <ReportClosing view={view} />}
      </Page>
      {rest.map((wheel, i) => (
        // One wheel per page: a wheel's record never splits from its drawing. A page of its own
        // rather than a page break also spares the layout engine laying out again everything
        // after each break.
        <Page key={wheel.position} size="LETTER" style={styles.page}>
          {footer}
          <WheelSection wheel={wheel} images={images} />
          {i === rest.length - 1 ? <ReportClosing view={view} /> : null}
        </Page>
      ))}
    </Document>
  );
}

function ReportHeader({ view, title }: { view: ReportView; title: string }) {
  return (
    <>
      <Text style={styles.title}>{view.shop.name}</Text>
      <Text style={styles.subtitle}>
        {title}
        {view.shop.contact ? ` · Contact: ${view.shop.contact}` : ''}
      </Text>
      <View style={styles.row}>
        <View style={styles.col}>
          <Text>
            <Text style={styles.label}>Customer: </Text>
            {view.customer}
          </Text>
          <Text>
            <Text style={styles.label}>Vehicle: </Text>
            {view.vehicle}
          </Text>
          <Text>
            <Text style={styles.label}>VIN: </Text>
            {view.vin}
          </Text>
        </View>
        <View style={styles.col}>
          <Text>
            <Text style={styles.label}>Job opened: </Text>
            {view.openedOn}
          </Text>
          <Text>
            <Text style={styles.label}>Work by: </Text>
            {view.workedBy.join(', ') || 'not recorded'}
          </Text>
          <Text>
            <Text style={styles.label}>Signed off by: </Text>
            {view.signedOff ? `${view.signedOff.by}, ${view.signedOff.at}` : 'not signed off'}
          </Text>
        </View>
      </View>
      <Text style={{ marginTop: 8 }}>{view.summary}</Text>
      {view.recheck ? (
        <View style={{ ...styles.box, ...styles.caution }}>
          <Text style={styles.bold}>Ring bolt re-check due by {view.recheck.dueOn}</Text>
          {view.recheck.what.map((w) => (
            <Text key={w}>• {w}</Text>
          ))}
        </View>
      ) : null}
    </>
  );
}

/** What follows the last wheel: the reasons noted at sign-off and the cautions. */
function ReportClosing({ view }: { view: ReportView }) {
  return (
    <>
      {view.acknowledgements.length ? (
        <View wrap={false}>
          <Text style={styles.h2}>Noted at sign-off</Text>
          {view.acknowledgements.map((a) => (
            <Text key={`${a.wheel}${a.message}`} style={{ marginBottom: 3 }}>
              {a.wheel}: {a.message} Reason accepted by {a.by} ({a.at}): {a.reason}
            </Text>
          ))}
        </View>
      ) : null}
      <View wrap={false}>
        <Text style={styles.h2}>Cautions</Text>
        {view.cautions.map((c) => (
          <Text key={c} style={styles.caution}>
            {c}
          </Text>
        ))}
        <Text style={{ ...styles.bold, marginTop: 8 }}>{view.makerFirst}</Text>
      </View>
    </>
  );
}
