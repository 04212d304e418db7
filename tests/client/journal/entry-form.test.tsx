import { describe, expect, it, vi } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { EntryForm, localToday } from '@/features/journal/components/entry-form';

const pieces = [
  { id: 11, name: 'Body' },
  { id: 12, name: 'Ear' },
];

function setup(props: Partial<Parameters<typeof EntryForm>[0]> = {}) {
  const onSubmit = vi.fn();
  const onCancel = vi.fn();
  render(<EntryForm pieces={pieces} onSubmit={onSubmit} onCancel={onCancel} {...props} />);
  return { onSubmit, onCancel, user: userEvent.setup() };
}

describe('the journal entry form', () => {
  it('refuses an empty entry with the shared schema’s sentence and sends nothing', async () => {
    const { onSubmit, user } = setup();
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(await screen.findByText('Write a few words about what you did.')).toBeInTheDocument();
    expect(screen.getByLabelText('What did you do?')).toHaveAttribute('aria-invalid', 'true');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('refuses negative or impossible working time', async () => {
    const { onSubmit, user } = setup();
    await user.type(screen.getByLabelText('What did you do?'), 'Rnd 5 done');
    const minutes = screen.getByLabelText('Working time (minutes)');
    await user.type(minutes, '-5');
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(await screen.findByText('Working time cannot be negative.')).toBeInTheDocument();
    await user.clear(minutes);
    await user.type(minutes, '2000');
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(await screen.findByText(/at most 24 hours/)).toBeInTheDocument();
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('sends the cleaned values: piece, tags toggled by their words, minutes as a number, today by default', async () => {
    const { onSubmit, user } = setup();
    await user.type(screen.getByLabelText('What did you do?'), '  Ear *done*, placed at Rnd 9  ');
    await user.type(screen.getByLabelText('Working time (minutes)'), '35');
    await user.selectOptions(screen.getByLabelText('Piece'), 'Ear');
    const tags = within(screen.getByRole('group', { name: 'What kind of note?' }));
    const placement = tags.getByRole('button', { name: 'Placement' });
    expect(placement).toHaveAttribute('aria-pressed', 'false');
    await user.click(placement);
    expect(placement).toHaveAttribute('aria-pressed', 'true');
    await user.click(tags.getByRole('button', { name: 'Change from the pattern' }));
    await user.click(tags.getByRole('button', { name: 'Problem' }));
    await user.click(tags.getByRole('button', { name: 'Problem' }));
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(onSubmit).toHaveBeenCalledTimes(1);
    expect(onSubmit.mock.calls[0][0]).toEqual({
      body: 'Ear *done*, placed at Rnd 9',
      entryDate: localToday(),
      minutes: 35,
      pieceId: 12,
      tags: ['placement', 'change'],
      onShowcase: false,
    });
    expect(onSubmit.mock.calls[0][1]).toEqual([]);
  });

  it('leaves minutes empty as null and "The whole project" as no piece', async () => {
    const { onSubmit, user } = setup();
    await user.type(screen.getByLabelText('What did you do?'), 'Bought stuffing');
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(onSubmit.mock.calls[0][0]).toMatchObject({ minutes: null, pieceId: null, tags: [] });
  });

  it('prefills the working time from the Tally and says so', () => {
    setup({ defaultMinutes: 42, defaultPieceId: 11 });
    expect(screen.getByLabelText('Working time (minutes)')).toHaveValue(42);
    expect(screen.getByText('Filled in from your counting on the Tally.')).toBeInTheDocument();
    expect(screen.getByLabelText('Piece')).toHaveValue('11');
  });

  it('offers the file picker and a separate camera button that opens the back camera', async () => {
    const { onSubmit, user } = setup();
    expect(screen.getByRole('button', { name: 'Choose photos' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Take a photo' })).toBeInTheDocument();
    const camera = screen.getByLabelText('Camera');
    expect(camera).toHaveAttribute('capture', 'environment');
    expect(camera).toHaveAttribute('accept', 'image/*');
    const picker = screen.getByLabelText('Photo files');
    expect(picker).toHaveAttribute('multiple');

    const a = new File([new Uint8Array([0xff, 0xd8, 0xff])], 'left-ear.jpg', { type: 'image/jpeg' });
    const b = new File([new Uint8Array([0xff, 0xd8, 0xff])], 'right-ear.jpg', { type: 'image/jpeg' });
    await user.upload(picker, [a, b]);
    const chosen = within(screen.getByRole('list', { name: 'Photos to add' }));
    expect(chosen.getByText('left-ear.jpg')).toBeInTheDocument();
    await user.click(chosen.getByRole('button', { name: 'Leave out left-ear.jpg' }));
    expect(chosen.queryByText('left-ear.jpg')).not.toBeInTheDocument();

    await user.type(screen.getByLabelText('What did you do?'), 'Both ears');
    await user.click(screen.getByRole('button', { name: 'Save entry' }));
    expect(onSubmit.mock.calls[0][1].map((f: File) => f.name)).toEqual(['right-ear.jpg']);
  });
});
