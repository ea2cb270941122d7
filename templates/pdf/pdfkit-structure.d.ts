// What pdfkit (0.18 on) accepts and its type package does not yet say: a link annotation given the
// structure element it belongs to, which pdfkit then records as that element's OBJR child.
declare namespace PDFKit.Mixins {
  interface AnnotationOption {
    structParent?: PDFKit.PDFStructureElement;
  }
}
