package org.dockgate.certificates;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.security.PrivateKey;
import java.security.cert.CertificateEncodingException;
import java.security.cert.X509Certificate;
import java.util.List;
import java.util.Map;
import org.bouncycastle.asn1.ASN1Encoding;
import org.bouncycastle.asn1.DERSet;
import org.bouncycastle.asn1.cms.Attribute;
import org.bouncycastle.asn1.cms.AttributeTable;
import org.bouncycastle.asn1.cms.CMSAttributes;
import org.bouncycastle.asn1.ess.ESSCertIDv2;
import org.bouncycastle.asn1.ess.SigningCertificateV2;
import org.bouncycastle.asn1.pkcs.PKCSObjectIdentifiers;
import org.bouncycastle.asn1.x500.X500Name;
import org.bouncycastle.asn1.x509.GeneralName;
import org.bouncycastle.asn1.x509.GeneralNames;
import org.bouncycastle.asn1.x509.IssuerSerial;
import org.bouncycastle.cert.jcajce.JcaCertStore;
import org.bouncycastle.cms.CMSAttributeTableGenerator;
import org.bouncycastle.cms.CMSException;
import org.bouncycastle.cms.CMSProcessableByteArray;
import org.bouncycastle.cms.CMSSignedDataGenerator;
import org.bouncycastle.cms.DefaultSignedAttributeTableGenerator;
import org.bouncycastle.cms.SignerInfoGenerator;
import org.bouncycastle.cms.jcajce.JcaSignerInfoGeneratorBuilder;
import org.bouncycastle.operator.OperatorCreationException;
import org.bouncycastle.operator.jcajce.JcaContentSignerBuilder;
import org.bouncycastle.operator.jcajce.JcaDigestCalculatorProviderBuilder;

/**
 * Detached CMS signatures (RFC 5652) as PAdES baseline B-B wants them (ETSI EN 319 142-1 6.2 and the CAdES
 * attributes of ETSI EN 319 122-1 5.2): SHA-256 digest, signed attributes content-type, message-digest and
 * ESS signing-certificate-v2 (RFC 5035) naming the signer's certificate by its SHA-256 hash, and no
 * signing-time attribute (PAdES takes the time from the signature dictionary's /M instead). The
 * certificates of the chain travel in the CMS so that a verifier can build the path to the root.
 */
final class CmsSignatures {

    private CmsSignatures() {
    }

    static byte[] detached(byte[] signedContent, PrivateKey key, List<X509Certificate> chain) {
        X509Certificate signer = chain.get(0);
        try {
            ESSCertIDv2 certId = new ESSCertIDv2(X509s.sha256(signer.getEncoded()), new IssuerSerial(
                    new GeneralNames(new GeneralName(X500Name.getInstance(signer.getIssuerX500Principal().getEncoded()))),
                    signer.getSerialNumber()));
            AttributeTable extra = new AttributeTable(new Attribute(PKCSObjectIdentifiers.id_aa_signingCertificateV2,
                    new DERSet(new SigningCertificateV2(new ESSCertIDv2[] {certId}))));
            CMSAttributeTableGenerator attributes = new DefaultSignedAttributeTableGenerator(extra) {
                @Override
                public AttributeTable getAttributes(@SuppressWarnings("rawtypes") Map parameters) {
                    return super.getAttributes(parameters).remove(CMSAttributes.signingTime);
                }
            };
            SignerInfoGenerator signerInfo = new JcaSignerInfoGeneratorBuilder(
                    new JcaDigestCalculatorProviderBuilder().build())
                    .setSignedAttributeGenerator(attributes)
                    .build(new JcaContentSignerBuilder(LabCertificateAuthority.signatureAlgorithm(key)).build(key), signer);
            CMSSignedDataGenerator generator = new CMSSignedDataGenerator();
            generator.addSignerInfoGenerator(signerInfo);
            generator.addCertificates(new JcaCertStore(chain));
            return generator.generate(new CMSProcessableByteArray(signedContent), false).getEncoded(ASN1Encoding.DER);
        } catch (CertificateEncodingException | OperatorCreationException | CMSException e) {
            throw new IllegalStateException("Cannot build the CMS signature", e);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
