export default entityDeleteRoute('amps')
