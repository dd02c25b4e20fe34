import {
  Avatar,
  Button,
  Menu,
  MenuDivider,
  MenuGroup,
  MenuGroupHeader,
  MenuItem,
  MenuList,
  MenuPopover,
  MenuTrigger,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { ChevronDownRegular, PersonRegular, SignOutRegular } from '@fluentui/react-icons';
import type { MeResponse } from '@rotaplex/contracts';
import { useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { ROLE_LABELS } from '@/features/auth/roleText';
import { signOut } from '@/features/auth/api/auth.queries';

const useStyles = makeStyles({
  trigger: {
    color: tokens.colorNeutralForegroundOnBrand,
    ':hover': {
      color: tokens.colorNeutralForegroundOnBrand,
      backgroundColor: tokens.colorBrandBackgroundHover,
    },
    ':hover:active': {
      color: tokens.colorNeutralForegroundOnBrand,
      backgroundColor: tokens.colorBrandBackgroundPressed,
    },
  },
  // On a narrow window the name is read out but not shown (visually hidden, still in the button's name).
  name: {
    '@media (max-width: 639px)': {
      position: 'absolute',
      width: '1px',
      height: '1px',
      overflow: 'hidden',
      clip: 'rect(0 0 0 0)',
      whiteSpace: 'nowrap',
    },
  },
});

export function UserMenu({ user }: { user: MeResponse }) {
  const styles = useStyles();
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  const handleSignOut = async () => {
    try {
      await signOut();
    } finally {
      queryClient.clear();
      navigate(PATHS.signIn, { replace: true });
    }
  };

  return (
    <Menu positioning="below-end">
      <MenuTrigger disableButtonEnhancement>
        <Button
          appearance="transparent"
          className={styles.trigger}
          icon={<Avatar name={user.displayName} size={28} color="colorful" aria-hidden />}
          iconPosition="before"
        >
          {/* The name is the visible text, so the accessible name contains it (WCAG 2.5.3 Label in Name). */}
          <span className="visually-hidden">Account menu for </span>
          <span className={styles.name}>{user.displayName}</span>
          <ChevronDownRegular aria-hidden />
        </Button>
      </MenuTrigger>
      <MenuPopover>
        <MenuList>
          <MenuGroup>
            <MenuGroupHeader>
              {user.email} · {ROLE_LABELS[user.role]}
            </MenuGroupHeader>
            <MenuItem icon={<PersonRegular />} onClick={() => navigate(PATHS.profile)}>
              Profile
            </MenuItem>
          </MenuGroup>
          <MenuDivider />
          <MenuItem icon={<SignOutRegular />} onClick={() => void handleSignOut()}>
            Sign out
          </MenuItem>
        </MenuList>
      </MenuPopover>
    </Menu>
  );
}
