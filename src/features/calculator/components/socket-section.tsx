import { CHECK_MARK_OFFSET_IN, type JointPicture } from '@shared/trade';
import type { DryFitWindow } from '../preview';
import { inches, mm } from '@/lib/format';
import { Fact, Facts, Section, Source } from './facts';

export function SocketSection({ picture: p, dryFit }: { picture: JointPicture; dryFit: DryFitWindow | null }) {
  const { socket, chamfer } = p;
  return (
    <Section title="Socket, marks and chamfer" id="socket">
      <Facts>
        {socket.ok ? (
          <>
            <Fact term="Socket depth" value={inches(socket.socketDepthIn)} metric={mm(socket.socketDepthIn)} note="Minimum; measure the fitting in hand." />
            <Fact term="Insertion mark" value={inches(socket.insertionMarkIn)} metric={mm(socket.insertionMarkIn)} note="From the pipe end, at the socket depth." />
            <Fact term="Check mark" value={inches(socket.checkMarkIn)} metric={mm(socket.checkMarkIn)} note={`${CHECK_MARK_OFFSET_IN} in beyond the insertion mark, since primer and cement wipe the first.`} />
          </>
        ) : (
          <Fact term="Socket depth" value="Not in the table" note={socket.reason} />
        )}
        {dryFit && (
          <Fact
            term="Dry fit enters"
            value={`${inches(dryFit.minIn)} – ${inches(dryFit.maxIn)}`}
            metric={`${mm(dryFit.minIn)} – ${mm(dryFit.maxIn)}`}
            note={`1/3 to 2/3 of the socket depth.${dryFit.makerMinIn !== undefined ? ` One maker asks 1/2 to 2/3 on this size: at least ${inches(dryFit.makerMinIn)}.` : ''}`}
          />
        )}
        {chamfer.ok && (
          <Fact
            term="Chamfer"
            value={`${chamfer.angleMinDeg}°–${chamfer.angleMaxDeg}°`}
            metric={chamfer.lengthMaxIn !== null ? `${mm(chamfer.lengthMinIn)} – ${mm(chamfer.lengthMaxIn)} long` : `more than ${mm(chamfer.lengthMinIn)} long`}
            note={`${chamfer.text} ${chamfer.note}`}
          />
        )}
      </Facts>
      <Source of={[socket.ok ? socket.source : null, dryFit?.source, chamfer.ok ? chamfer.source : null]} />
    </Section>
  );
}
