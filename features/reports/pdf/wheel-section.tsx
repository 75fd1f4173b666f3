import { Image, Text, View } from '@react-pdf/renderer';
import type { WheelView } from '../wheel-view';
import { BoltCircleDrawing } from './bolt-circle-drawing';
import { styles } from './styles';

export type PhotoImage = { data: Buffer; format: 'jpg' | 'png' };

function Field({ label, value }: { label: string; value: string }) {
  return (
    <Text>
      <Text style={styles.label}>{label}: </Text>
      {value}
    </Text>
  );
}

export function WheelSection({
  wheel,
  images,
}: {
  wheel: WheelView;
  images: Record<string, PhotoImage | null>;
}) {
  const spec = wheel.spec;
  return (
    <View style={styles.box}>
      <Text style={styles.h2}>
        {wheel.position} · {wheel.positionName} wheel
      </Text>
      <View style={styles.row}>
        <View style={styles.col}>
          <Field label="Tire" value={`${wheel.tireSize}. ${wheel.direction}`} />
          {spec ? (
            <>
              <Field label="Wheel spec" value={spec.name} />
              <Field
                label="Ring bolts"
                value={`${spec.boltCount} × ${spec.boltThread}, ${spec.pattern} pattern`}
              />
              <Field label="Final torque" value={spec.finalTorque} />
              <Field label="Threads" value={spec.threadCondition} />
              <Field label="Bolt reuse" value={spec.boltReuse} />
              <Field label="Wheel maker's reference" value={spec.makerReference} />
            </>
          ) : (
            <Text>No spec was recorded for this wheel.</Text>
          )}
          <Field
            label="Bead seated at"
            value={`${wheel.beadSeatUsed ?? 'not recorded'} (limit ${wheel.beadSeatLimit ?? 'not recorded'})`}
          />
          <Field
            label="Pressure set"
            value={`${wheel.pressureSet ?? 'not recorded'} (target ${wheel.targetPressure})`}
          />
          <Field label="Work by" value={wheel.workedBy.join(', ') || 'not recorded'} />
          {wheel.submittedAt ? <Field label="Finished" value={wheel.submittedAt} /> : null}
          <Field label="Tightening sequence" value={wheel.sequence.join('-')} />
        </View>
        {spec ? (
          <View>
            <BoltCircleDrawing count={spec.boltCount} sequence={wheel.sequence} />
            <Text style={{ ...styles.label, fontSize: 7, width: 150 }}>
              Outside: bolt number, bolt 1 first clockwise past the valve notch. Inside: its place
              in the sequence.
            </Text>
          </View>
        ) : null}
      </View>
      <Text style={styles.h3}>Torque passes</Text>
      <View style={styles.table}>
        {wheel.passes.map((p) => (
          <View key={p.index} style={styles.tr}>
            <Text style={{ ...styles.td, flexGrow: 0.8 }}>{p.kind}</Text>
            <Text style={styles.td}>Target {p.target}</Text>
            <View style={{ ...styles.td, flexGrow: 2.4 }}>
              {p.wrenches.length ? (
                p.wrenches.map((w) => (
                  <Text key={`${w.label}${w.setting}`}>
                    {w.label} ({w.serial}) set to {w.setting}, {w.bolts} bolts; last verified{' '}
                    {w.lastVerification}
                  </Text>
                ))
              ) : (
                <Text>No bolt confirmed on this pass.</Text>
              )}
            </View>
          </View>
        ))}
      </View>
      {wheel.photos.length ? (
        <>
          <Text style={styles.h3}>Photos</Text>
          <View style={{ ...styles.row, flexWrap: 'wrap', gap: 0 }}>
            {wheel.photos.map((p) => {
              const image = images[p.id];
              return (
                <View key={p.id} style={{ width: 156 }}>
                  {image ? (
                    // A PDF image has no alt text; the caption below says what it shows. The
                    // bytes go in as they are: given `{ data, format }`, the PDF library keys its
                    // image cache by the whole image in base64 and keeps the last 30 for ever.
                    // eslint-disable-next-line jsx-a11y/alt-text
                    <Image src={image.data} style={styles.photo} />
                  ) : (
                    <Text style={styles.label}>(photo not available)</Text>
                  )}
                  <Text style={{ fontSize: 7 }}>{p.caption}</Text>
                </View>
              );
            })}
          </View>
        </>
      ) : null}
    </View>
  );
}
