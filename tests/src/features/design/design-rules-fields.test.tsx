// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { DesignRulesFields } from '@/features/design/components/design-rules-fields';
import { defaultDesignForm } from '@/features/design/utils/build-design-spec';

afterEach(cleanup);

const definition: StudyDefinition = {
  attributes: [],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: { kind: 'status_quo', label: 'Keep the current service', levels: {} },
  excludedCombinations: [],
};

describe('DesignRulesFields', () => {
  it('names the status quo in its dominance switches and turns one off alone', async () => {
    const onChange = vi.fn();
    render(
      <DesignRulesFields
        definition={definition}
        values={defaultDesignForm}
        errors={new Map()}
        onChange={onChange}
      />,
    );
    const over = screen.getByRole('checkbox', {
      name: 'No option dominates “Keep the current service”',
    });
    expect(over).toBeChecked();
    await userEvent.click(over);
    expect(onChange).toHaveBeenCalledWith({
      dominance: { betweenDesigned: true, overFixed: false, byFixed: true },
    });
  });

  it('without an opt-out or status quo, offers only the rule between options', () => {
    render(
      <DesignRulesFields
        definition={{ ...definition, fixedAlternative: null }}
        values={defaultDesignForm}
        errors={new Map([['balance.minAppearances', 'Too small']])}
        onChange={vi.fn()}
      />,
    );
    expect(screen.getAllByRole('checkbox', { name: /dominates/ })).toHaveLength(1);
    expect(screen.getByText('Too small')).toBeInTheDocument();
  });
});
