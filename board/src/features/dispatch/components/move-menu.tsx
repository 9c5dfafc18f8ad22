import { forwardRef, type PointerEvent } from 'react';
import {
  Menu,
  MenuButton,
  MenuDivider,
  MenuGroup,
  MenuGroupHeader,
  MenuItem,
  MenuItemRadio,
  MenuList,
  MenuPopover,
  MenuTrigger,
  makeStyles,
  tokens,
  type MenuButtonProps,
} from '@fluentui/react-components';
import { BAY_PALETTE, PRIORITIES, skillWords, type DispatchBoard, type DispatchLine } from '@baytime/shared';
import { Glyph } from '@/components/glyph';
import { skillWarning, type MoveTarget } from '../dispatch-model';
import { PRIORITY_LABELS, TECH_STATUS_LABELS } from '../dispatch-words';

const useStyles = makeStyles({
  caution: { width: '16px', height: '16px', color: tokens.colorStatusWarningForeground1 },
  warn: { color: tokens.colorStatusWarningForeground1 },
});

const MoveButton = forwardRef<HTMLButtonElement, MenuButtonProps>(function MoveButton(props, ref) {
  // Pointer presses on the button must open the menu, not start a drag of the card under it.
  return (
    <MenuButton
      ref={ref}
      {...props}
      onPointerDown={(event: PointerEvent<HTMLButtonElement & HTMLAnchorElement>) => {
        event.stopPropagation();
        props.onPointerDown?.(event);
      }}
    />
  );
});

export interface MoveMenuProps {
  line: DispatchLine;
  board: DispatchBoard;
  onMove: (target: MoveTarget) => void;
}

/** Everything drag and drop can do, from the keyboard: technician, bay, priority, back to the queue. */
export const MoveMenu = forwardRef<HTMLButtonElement, MoveMenuProps>(function MoveMenu(
  { line, board, onMove },
  ref,
) {
  const styles = useStyles();
  const label = `Move line ${line.lineNo}, ${line.title}, RO ${line.repairOrderNumber}`;
  return (
    <Menu
      checkedValues={{ technician: line.technicianId === null ? [] : [String(line.technicianId)] }}
      onCheckedValueChange={(_, { name, checkedItems }) => {
        const value = checkedItems[0];
        if (name === 'technician' && value) onMove({ kind: 'technician', technicianId: Number(value) });
      }}
    >
      <MenuTrigger disableButtonEnhancement>
        <MoveButton ref={ref} size="small" appearance="subtle" aria-label={label}>
          Move…
        </MoveButton>
      </MenuTrigger>
      <MenuPopover>
        <MenuList>
          <MenuGroup>
            <MenuGroupHeader>Technician</MenuGroupHeader>
            {board.lanes.map((lane) => {
              const warning = skillWarning(line, lane);
              return (
                <MenuItemRadio
                  key={lane.technician.id}
                  name="technician"
                  value={String(lane.technician.id)}
                  icon={warning ? <Glyph name="caution" className={styles.caution} /> : undefined}
                  secondaryContent={
                    warning ? (
                      <span className={styles.warn}>{warning}</span>
                    ) : (
                      `${skillWords(lane.technician.skillLevel)} · ${TECH_STATUS_LABELS[lane.technician.status]}`
                    )
                  }
                >
                  {lane.technician.name}
                </MenuItemRadio>
              );
            })}
          </MenuGroup>
          {line.technicianId !== null && (
            <MenuItem onClick={() => onMove({ kind: 'queue' })}>Unassign: back to the queue</MenuItem>
          )}
          <MenuDivider />
          <Menu
            checkedValues={{ bay: [line.bayId === null ? 'none' : String(line.bayId)] }}
            onCheckedValueChange={(_, { checkedItems }) => {
              const value = checkedItems[0];
              if (value) onMove({ kind: 'bay', bayId: value === 'none' ? null : Number(value) });
            }}
          >
            <MenuTrigger disableButtonEnhancement>
              <MenuItem>Bay</MenuItem>
            </MenuTrigger>
            <MenuPopover>
              <MenuList>
                {board.bays.map((bay) => (
                  <MenuItemRadio
                    key={bay.id}
                    name="bay"
                    value={String(bay.id)}
                    secondaryContent={BAY_PALETTE[bay.state].label}
                  >
                    {bay.name}
                  </MenuItemRadio>
                ))}
                <MenuDivider />
                <MenuItemRadio name="bay" value="none">
                  No bay
                </MenuItemRadio>
              </MenuList>
            </MenuPopover>
          </Menu>
          <Menu
            checkedValues={{ priority: [line.priority] }}
            onCheckedValueChange={(_, { checkedItems }) => {
              const value = checkedItems[0] as DispatchLine['priority'] | undefined;
              if (value) onMove({ kind: 'priority', priority: value });
            }}
          >
            <MenuTrigger disableButtonEnhancement>
              <MenuItem>Priority</MenuItem>
            </MenuTrigger>
            <MenuPopover>
              <MenuList>
                {[...PRIORITIES].reverse().map((priority) => (
                  <MenuItemRadio key={priority} name="priority" value={priority}>
                    {PRIORITY_LABELS[priority]}
                  </MenuItemRadio>
                ))}
              </MenuList>
            </MenuPopover>
          </Menu>
        </MenuList>
      </MenuPopover>
    </Menu>
  );
});
