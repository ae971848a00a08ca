import type { Metadata } from "next";
import QRCode from "qrcode";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { env } from "@/lib/env";
import { publicBaseUrl, shopAuthority } from "@/lib/net/shop-certificate";
import { DesktopPicture, PhoneSettingsPicture, TabletPicture } from "./_components/pictures";

export const metadata: Metadata = { title: "Devices" };

function Steps({ items }: { items: React.ReactNode[] }) {
  return (
    <ol className="mt-2 list-decimal space-y-1 pl-5 text-graphite-800">
      {items.map((item, i) => (
        <li key={i}>{item}</li>
      ))}
    </ol>
  );
}

export default async function DevicesPage() {
  await requireShop("devices:manage");
  const ca = shopAuthority();
  const address = publicBaseUrl();
  const lan = env().LAN_URL;
  const qr = await QRCode.toString(address, { type: "svg", margin: 1, errorCorrectionLevel: "M", color: { dark: "#0e1110", light: "#ffffff" } });
  return (
    <>
      <PageHeader title="Devices" lead="Welders' tablets, inspectors' and auditors' phones: how they reach Gusset on the shop's network." />
      <section className="card mb-4 p-4" aria-labelledby="why-h">
        <h2 id="why-h" className="font-bold">Why a certificate</h2>
        <p className="mt-1 max-w-3xl text-graphite-800">
          A signed record needs a private line. Signatures, PINs and passwords travel from the tablet to this computer; over plain
          http anyone on the Wi-Fi could read or change them. Gusset therefore answers other devices only over HTTPS, with a
          certificate issued by this shop&apos;s own authority. Install that authority once on each device and the browser trusts
          the connection, the camera can scan QR codes and Gusset can be added to the home screen.
        </p>
      </section>
      <div className="grid gap-4 lg:grid-cols-2">
        <section className="card p-4" aria-labelledby="address-h">
          <h2 id="address-h" className="font-bold">Address for tablets and phones</h2>
          <p className="figures mt-2 break-all text-xl font-semibold" data-testid="device-address">{address}</p>
          <div className="mt-3 flex flex-wrap items-start gap-4">
            <div className="h-44 w-44 shrink-0 rounded-md border-2 border-graphite-200 bg-white p-1" data-testid="device-qr" role="img" aria-label={`QR code of ${address}`} dangerouslySetInnerHTML={{ __html: qr }} />
            <p className="max-w-xs text-sm text-graphite-600">
              Scan it with the device&apos;s camera, or type the address. {lan ? "It is this computer's address on the shop's network." : "It is the address your own proxy serves."}
            </p>
          </div>
        </section>
        <section className="card p-4" aria-labelledby="cert-h">
          <h2 id="cert-h" className="font-bold">Shop certificate</h2>
          {ca ? (
            <>
              <p className="mt-1 text-graphite-800">Install it on each device once. Before trusting it, compare its fingerprint with the one the device shows:</p>
              <p className="figures mt-2 break-all rounded-md bg-graphite-50 p-2 text-sm" data-testid="ca-fingerprint">SHA-256 {ca.fingerprint}</p>
              <div className="mt-3 flex flex-wrap gap-2">
                <a className="btn btn-primary min-h-12" href="/api/shop-certificate?format=der" download>Download certificate (.crt)</a>
                <a className="btn btn-quiet min-h-12" href="/api/shop-certificate?format=pem" download>PEM file (.pem)</a>
              </div>
              <p className="mt-2 text-sm text-graphite-600">Valid until {ca.validTo}. It stays the same when this computer&apos;s addresses change.</p>
            </>
          ) : (
            <p className="mt-1 text-graphite-800" data-testid="no-shop-certificate">
              Gusset is served at {address} through a proxy with a certificate of its own: devices need nothing installed.
            </p>
          )}
        </section>
      </div>
      {ca ? (
        <section className="mt-4 grid gap-4 md:grid-cols-3" aria-label="Installing the certificate">
          <article className="card p-4">
            <TabletPicture label="Android tablet with the certificate" />
            <h3 className="mt-2 font-bold">Android tablets</h3>
            <Steps
              items={[
                <>Open the address above in Chrome; on the warning page choose <strong>Advanced → Proceed</strong>, then download the .crt file.</>,
                <>Settings → <strong>Security and privacy → More security settings → Install from device storage → CA certificate</strong> (names vary by maker; search Settings for “certificate”).</>,
                <>Choose the downloaded file and confirm. Close Chrome and open the address again: no warning.</>,
              ]}
            />
          </article>
          <article className="card p-4">
            <PhoneSettingsPicture label="iPad settings with the certificate" />
            <h3 className="mt-2 font-bold">iPad and iPhone</h3>
            <Steps
              items={[
                <>Open the address in Safari, choose <strong>Show Details → visit this website</strong>, then download the .crt file and allow it.</>,
                <>Settings → <strong>Profile Downloaded → Install</strong>, and enter the device passcode.</>,
                <>Settings → <strong>General → About → Certificate Trust Settings</strong>: switch on full trust for the Gusset shop authority.</>,
              ]}
            />
          </article>
          <article className="card p-4">
            <DesktopPicture label="Desktop browser with a padlock" />
            <h3 className="mt-2 font-bold">Desktop browsers</h3>
            <Steps
              items={[
                <><strong>Windows</strong> (Edge, Chrome): open the .crt → Install Certificate → Local Machine → <strong>Trusted Root Certification Authorities</strong>.</>,
                <><strong>macOS</strong> (Safari, Chrome): open the .crt in Keychain Access → System → double-click it → Trust: <strong>Always Trust</strong>.</>,
                <><strong>Firefox</strong>: Settings → Privacy &amp; Security → Certificates → View Certificates → Authorities → <strong>Import</strong>, trust for websites.</>,
              ]}
            />
          </article>
        </section>
      ) : null}
    </>
  );
}
