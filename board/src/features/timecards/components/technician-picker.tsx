import { Field, Select, makeStyles } from '@fluentui/react-components';

export interface TechnicianOption {
  id: number;
  name: string;
  active: boolean;
}

const useStyles = makeStyles({ field: { minWidth: '14rem' } });

/** Active technicians first, by name; those who left after them, marked. */
export function TechnicianPicker({
  technicians,
  value,
  onChange,
}: {
  technicians: readonly TechnicianOption[];
  value: number | null;
  onChange: (id: number) => void;
}) {
  const styles = useStyles();
  const sorted = [...technicians].sort(
    (a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name),
  );
  return (
    <Field label="Technician" orientation="horizontal" className={styles.field}>
      <Select
        value={value === null ? '' : String(value)}
        onChange={(_, data) => onChange(Number(data.value))}
      >
        {value === null && <option value="">Choose…</option>}
        {sorted.map((tech) => (
          <option key={tech.id} value={tech.id}>
            {tech.active ? tech.name : `${tech.name} (no longer active)`}
          </option>
        ))}
      </Select>
    </Field>
  );
}
